namespace SortRig.Measurement.Settling;

/// <summary>Options of the settle rule for values typed by a person. Each property is validated when set.</summary>
public sealed record HandSettleOptions
{
    private readonly int _agreeing = 2;
    private readonly int _agreeCounts = 1;
    private readonly TimeSpan _minGap = TimeSpan.FromSeconds(3);
    private readonly int _maxEntries = 6;

    /// <summary>The default options.</summary>
    public static HandSettleOptions Default { get; } = new();

    /// <summary>Entries in a row that must agree (K). Default 2; valid [2, 10].</summary>
    public int Agreeing
    {
        get => _agreeing;
        init =>
            _agreeing = value is >= 2 and <= 10
                ? value
                : throw new ArgumentOutOfRangeException(nameof(Agreeing), value, "Agreeing must be in [2, 10].");
    }

    /// <summary>Largest spread of the agreeing entries, in display digits. Default 1 (the last digit may flicker by
    /// one); valid [0, 100].</summary>
    public int AgreeCounts
    {
        get => _agreeCounts;
        init =>
            _agreeCounts = value is >= 0 and <= 100
                ? value
                : throw new ArgumentOutOfRangeException(nameof(AgreeCounts), value, "AgreeCounts must be in [0, 100].");
    }

    /// <summary>Least time between two counted entries. Default 3 s (long enough to let go and look again); valid [0,
    /// 60 s].</summary>
    public TimeSpan MinGap
    {
        get => _minGap;
        init =>
            _minGap =
                value >= TimeSpan.Zero && value <= TimeSpan.FromSeconds(60)
                    ? value
                    : throw new ArgumentOutOfRangeException(nameof(MinGap), value, "MinGap must be in [0, 60 s].");
    }

    /// <summary>Counted entries after which a part that still moves is declared unstable. Default 6; valid [2, 50], at
    /// least <see cref="Agreeing"/>.</summary>
    public int MaxEntries
    {
        get => _maxEntries;
        init =>
            _maxEntries = value is >= 2 and <= 50
                ? value
                : throw new ArgumentOutOfRangeException(nameof(MaxEntries), value, "MaxEntries must be in [2, 50].");
    }
}
