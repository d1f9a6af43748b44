using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Tests;

/// <summary>
/// An invented 6½-digit bench meter for the tests: magnitudes typical of the class, not a reference
/// and not any real model's data sheet. Figures the tests check are derived by hand from these in comments.
/// </summary>
internal static class InventedMeter
{
    public static readonly RangeSpec R100 = new(100, 1.2, new AccuracySpec(0.0030, 0.0030), new AccuracySpec(0.0100, 0.0040), 1e-3);
    public static readonly RangeSpec R1k = new(1_000, 1.2, new AccuracySpec(0.0020, 0.0005), new AccuracySpec(0.0100, 0.0010), 1e-3);
    public static readonly RangeSpec R10k = new(10_000, 1.2, new AccuracySpec(0.0020, 0.0005), new AccuracySpec(0.0100, 0.0010), 1e-4);
    public static readonly RangeSpec R100k = new(100_000, 1.2, new AccuracySpec(0.0020, 0.0005), new AccuracySpec(0.0100, 0.0010), 1e-5);
    public static readonly RangeSpec R1M = new(1_000_000, 1.2, new AccuracySpec(0.0020, 0.0010), new AccuracySpec(0.0100, 0.0010), 5e-6);
    public static readonly RangeSpec R10M = new(10_000_000, 1.2, new AccuracySpec(0.0150, 0.0010), new AccuracySpec(0.0400, 0.0010), 5e-7);

    public static readonly NplcSpec Fast = new(0.02, 4.5, 100, 500, 30);
    public static readonly NplcSpec Medium = new(0.2, 5.5, 10, 150, 3);
    public static readonly NplcSpec One = new(1, 6.5, 1, 45, 0.6);
    public static readonly NplcSpec Ten = new(10, 6.5, 0.1, 5, 0.2);
    public static readonly NplcSpec Hundred = new(100, 6.5, 0.1, 0.5, 0.1);

    public static MeterSpec Spec(bool fourWire = true) => new(
        "invented-6half-test",
        [R100, R1k, R10k, R100k, R1M, R10M],
        [Fast, Medium, One, Ten, Hundred],
        fourWire,
        TimeSpan.FromMilliseconds(100));
}
