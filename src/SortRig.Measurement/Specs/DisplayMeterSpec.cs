namespace SortRig.Measurement.Specs;

/// <summary>A meter with no computer link, read by eye: its family name and ranges, ascending.</summary>
/// <param name="Family">Profile family name.</param>
/// <param name="Ranges">At least one range, ascending full scale.</param>
public sealed record DisplayMeterSpec(string Family, IReadOnlyList<DisplayRange> Ranges)
{
    /// <summary>The range whose full scale is within 1 ppm of <paramref name="fullScale"/>, or null.</summary>
    public DisplayRange? Find(double fullScale) =>
        Ranges.FirstOrDefault(r => Math.Abs(r.FullScale - fullScale) <= 1e-6 * r.FullScale);
}
