using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Tests;

/// <summary>
/// An invented 6½-digit bench meter for the tests: the SortRig envelope (docs/instruments.md, "The SortRig
/// envelope"), invented for SortRig from physics and plausible for the class, not a reference and not any real
/// model's data sheet. Over-range 1.25 × full scale. Figures the tests check are derived by hand from these in
/// comments.
/// </summary>
internal static class InventedMeter
{
    // Accuracy as ±(% of reading + % of range), 24 h then 1 y; test current in amperes (full-scale voltage 0.2-0.8 V).
    public static readonly RangeSpec R100 = new(
        100,
        1.25,
        new AccuracySpec(0.0040, 0.0025),
        new AccuracySpec(0.0120, 0.0035),
        2e-3
    );
    public static readonly RangeSpec R1k = new(
        1_000,
        1.25,
        new AccuracySpec(0.0025, 0.0006),
        new AccuracySpec(0.0090, 0.0008),
        5e-4
    );
    public static readonly RangeSpec R10k = new(
        10_000,
        1.25,
        new AccuracySpec(0.0025, 0.0004),
        new AccuracySpec(0.0085, 0.0006),
        5e-5
    );
    public static readonly RangeSpec R100k = new(
        100_000,
        1.25,
        new AccuracySpec(0.0030, 0.0004),
        new AccuracySpec(0.0095, 0.0006),
        8e-6
    );
    public static readonly RangeSpec R1M = new(
        1_000_000,
        1.25,
        new AccuracySpec(0.0040, 0.0006),
        new AccuracySpec(0.0120, 0.0008),
        8e-7
    );
    public static readonly RangeSpec R10M = new(
        10_000_000,
        1.25,
        new AccuracySpec(0.0120, 0.0008),
        new AccuracySpec(0.0350, 0.0010),
        8e-8
    );
    public static readonly RangeSpec R50M = new(
        50_000_000,
        1.25,
        new AccuracySpec(0.0600, 0.0030),
        new AccuracySpec(0.1500, 0.0040),
        1.6e-8
    );

    // NPLC, digits, step (ppm of range), readings/s at 50 Hz with autozero, rms noise (ppm of range).
    public static readonly NplcSpec Fast = new(0.04, 4.5, 40, 380, 12);
    public static readonly NplcSpec Medium = new(0.4, 5.5, 4, 58, 2);
    public static readonly NplcSpec One = new(1, 6.5, 1, 24, 0.7);
    public static readonly NplcSpec Four = new(4, 6.5, 0.5, 6.2, 0.35);
    public static readonly NplcSpec Ten = new(10, 6.5, 0.2, 2.5, 0.25);
    public static readonly NplcSpec Forty = new(40, 6.5, 0.1, 0.62, 0.15);

    public static MeterSpec Spec(bool fourWire = true) =>
        new(
            "invented-6half-test",
            [R100, R1k, R10k, R100k, R1M, R10M, R50M],
            [Fast, Medium, One, Four, Ten, Forty],
            fourWire,
            TimeSpan.FromMilliseconds(100)
        );
}
