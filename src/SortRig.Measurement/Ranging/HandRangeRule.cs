using System.Globalization;
using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Ranging;

/// <summary>
/// The range rule for a meter read by eye: which range the operator sets by hand, and what is wrong
/// with a range the operator set instead (overflow, a lost digit, a digit too coarse for the match).
/// See docs/instruments.md, "Typed readings".
/// </summary>
public static class HandRangeRule
{
    /// <summary>k·u of one digit must fit this fraction of the match band (4:1, common practice, no source).</summary>
    public const double UncertaintyRatio = 0.25;

    /// <summary>The recommended range, judged.</summary>
    /// <exception cref="ArgumentException">No range shows the batch's largest part.</exception>
    public static HandRangeDecision Choose(DisplayMeterSpec spec, HandRangeRequest request) =>
        Check(spec, request, Recommend(spec, request));

    /// <summary>Judges <paramref name="selected"/> (a range of <paramref name="spec"/>) for the batch.</summary>
    /// <exception cref="ArgumentException">No range of the meter shows the batch's largest part.</exception>
    public static HandRangeDecision Check(DisplayMeterSpec spec, HandRangeRequest request, DisplayRange selected)
    {
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(selected);
        var recommended = Recommend(spec, request);
        var warnings = new List<HandRangeWarning>();
        if (selected.DisplayMax < request.Highest)
        {
            warnings.Add(
                new HandRangeWarning(
                    HandRangeWarningKind.Overflow,
                    string.Create(
                        System.Globalization.CultureInfo.InvariantCulture,
                        $"the {selected.Name} range shows at most {selected.Show(selected.DisplayMax)}, but parts up "
                            + $"to {Ohms(request.Highest)} are expected and would read overload: set the "
                            + $"{recommended.Name} range"
                    )
                )
            );
        }
        else if (selected.Step > recommended.Step * 1.5)
        {
            var lost = (int)Math.Round(Math.Log10(selected.Step / recommended.Step));
            warnings.Add(
                new HandRangeWarning(
                    HandRangeWarningKind.LostDigit,
                    string.Create(
                        System.Globalization.CultureInfo.InvariantCulture,
                        $"the {selected.Name} range shows {lost} digit{(lost == 1 ? "" : "s")} less than the "
                            + $"{recommended.Name} range (one digit = {Ohms(selected.Step)} instead of "
                            + $"{Ohms(recommended.Step)}): set the {recommended.Name} range unless you have a reason"
                    )
                )
            );
        }

        // One digit read by eye is a rectangular half-digit (GUM 4.3.7): k·u = 2 × step/(2√3) = step/√3.
        var expandedDigit = selected.Step / Math.Sqrt(3);
        var allowed = UncertaintyRatio * request.MatchTolerance * request.Nominal;
        if (expandedDigit > allowed)
        {
            var widest = expandedDigit / (UncertaintyRatio * request.Nominal);
            warnings.Add(
                new HandRangeWarning(
                    HandRangeWarningKind.Coarse,
                    string.Create(
                        System.Globalization.CultureInfo.InvariantCulture,
                        $"one digit on the {selected.Name} range is {selected.Step / request.Nominal * 1e6:0.#} ppm "
                            + $"of {Ohms(request.Nominal)}: too coarse for a ±{request.MatchTolerance * 1e6:0.#} ppm "
                            + $"match; the display resolves a match of ±{RoundUp2(widest) * 1e6:0.#} ppm or wider"
                    )
                )
            );
        }

        return new HandRangeDecision(selected, recommended, warnings);
    }

    /// <summary>The lowest range whose display shows nominal × (1 + stock) × (1 + margin).</summary>
    public static DisplayRange Recommend(DisplayMeterSpec spec, HandRangeRequest request)
    {
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(request);
        request.Validate();
        return spec.Ranges.FirstOrDefault(r => r.DisplayMax >= request.Highest)
            ?? throw new ArgumentException(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"no range of {spec.Family} shows {Ohms(request.Highest)}: the largest shows "
                        + $"{Ohms(spec.Ranges[^1].DisplayMax)}"
                ),
                nameof(request)
            );
    }

    private static double RoundUp2(double x)
    {
        var scale = Math.Pow(10, Math.Floor(Math.Log10(x)) - 1);
        return Math.Ceiling(x / scale * (1 - 1e-12)) * scale;
    }

    private static string Ohms(double ohms) => Readings.OhmsText.Format(ohms, 5);
}
