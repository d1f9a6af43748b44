using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Tests;

/// <summary>
/// An invented 50 000-count hand-held meter read by eye (the figures of instruments/typed/handheld-typed.yaml,
/// invented for SortRig, not any real model's data sheet).
/// </summary>
internal static class TypedMeter
{
    public static DisplayRange R500 { get; } = new(500, 50_000, 0.09, 6);

    public static DisplayRange R5k { get; } = new(5_000, 50_000, 0.06, 4);

    public static DisplayRange R50k { get; } = new(50_000, 50_000, 0.06, 4);

    public static DisplayRange R500k { get; } = new(500_000, 50_000, 0.07, 4);

    public static DisplayRange R5M { get; } = new(5e6, 50_000, 0.25, 5);

    public static DisplayRange R50M { get; } = new(50e6, 50_000, 1.3, 8);

    public static DisplayMeterSpec Spec { get; } = new("handheld-typed", [R500, R5k, R50k, R500k, R5M, R50M]);
}
