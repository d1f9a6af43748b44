namespace SortRig.Simulator.Meter;

/// <summary>The measurement function.</summary>
internal enum MeterFunction
{
    /// <summary>2-wire resistance (RESistance).</summary>
    Resistance = 0,

    /// <summary>4-wire resistance (FRESistance).</summary>
    FourWireResistance = 1,
}

/// <summary>Trigger source.</summary>
internal enum TriggerSource
{
    Immediate = 0,
    Bus = 1,
}

/// <summary>Range and integration settings kept separately for each function.</summary>
internal sealed record FunctionSettings(double Range, bool AutoRange, double Nplc)
{
    public static FunctionSettings Default { get; } = new(ResistanceRanges.Default, true, NplcSetting.Default.Nplc);
}

/// <summary>The whole configuration of the meter; *RST restores <see cref="Default"/>.</summary>
internal sealed record MeterSettings(
    MeterFunction Function,
    FunctionSettings TwoWire,
    FunctionSettings FourWire,
    bool AutoZero,
    TriggerSource TriggerSource,
    int TriggerCount,
    int SampleCount
)
{
    /// <summary>Largest TRIGger:COUNt (our own limit).</summary>
    public const int MaxTriggerCount = 5_000;

    /// <summary>Largest SAMPle:COUNt (our own limit).</summary>
    public const int MaxSampleCount = 1_000;

    /// <summary>Readings one INITiate may hold: trigger count × sample count × scan channels (our own limit; -223
    /// above).</summary>
    public const int ReadingBuffer = 20_000;

    public static MeterSettings Default { get; } =
        new(
            MeterFunction.Resistance,
            FunctionSettings.Default,
            FunctionSettings.Default,
            true,
            TriggerSource.Immediate,
            1,
            1
        );

    public FunctionSettings Active => For(Function);

    public FunctionSettings For(MeterFunction function) => function == MeterFunction.Resistance ? TwoWire : FourWire;

    public MeterSettings With(MeterFunction function, FunctionSettings settings) =>
        function == MeterFunction.Resistance ? this with { TwoWire = settings } : this with { FourWire = settings };
}
