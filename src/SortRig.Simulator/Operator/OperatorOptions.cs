namespace SortRig.Simulator.Operator;

/// <summary>Whether the virtual operator feeds the fixture by itself.</summary>
public enum OperatorMode
{
    /// <summary>Starts feeding parts when the bench starts serving.</summary>
    Auto = 0,

    /// <summary>Does nothing unless told (Start(), or the side channel's FIXTure:INSert).</summary>
    Manual = 1,

    /// <summary>
    /// Waits for the host's cue (Start()) and then feeds parts as in Auto: a person puts the first part in
    /// when the tool says it is ready, not while it is still connecting and setting the meter up.
    /// </summary>
    OnCue = 2,
}

/// <summary>Timing and handling of the virtual operator. Times are on the bench clock.</summary>
public sealed record OperatorOptions
{
    /// <summary>Auto, manual or on cue. Default Auto.</summary>
    public OperatorMode Mode { get; init; } = OperatorMode.Auto;

    /// <summary>Shortest handling time before insertion; 0 to 60 s. Default 1 s.</summary>
    public TimeSpan HandlingTimeMin { get; init; } = TimeSpan.FromSeconds(1);

    /// <summary>Longest handling time before insertion; 0 to 60 s. Default 3 s.</summary>
    public TimeSpan HandlingTimeMax { get; init; } = TimeSpan.FromSeconds(3);

    /// <summary>Least warming of the part by the fingers, K above ambient at insertion; 0 to 30. Default 2.</summary>
    public double WarmKelvinMin { get; init; } = 2;

    /// <summary>Most warming of the part by the fingers, K above ambient at insertion; 0 to 30. Default 6.</summary>
    public double WarmKelvinMax { get; init; } = 6;

    /// <summary>Longest a part stays in the fixture without an announcement; 1 s to 1 h. Default 60 s.</summary>
    public TimeSpan MaxDwell { get; init; } = TimeSpan.FromSeconds(60);

    /// <summary>Shortest pause after removing a part; 0 to 60 s. Default 0.5 s.</summary>
    public TimeSpan ReactionTimeMin { get; init; } = TimeSpan.FromSeconds(0.5);

    /// <summary>Longest pause after removing a part; 0 to 60 s. Default 1.5 s.</summary>
    public TimeSpan ReactionTimeMax { get; init; } = TimeSpan.FromSeconds(1.5);

    /// <summary>Throws naming the first invalid option and its valid range.</summary>
    public OperatorOptions Validate()
    {
        var minute = TimeSpan.FromMinutes(1);
        OptionGuard.InRange(HandlingTimeMin, TimeSpan.Zero, minute, "OperatorOptions.HandlingTimeMin");
        OptionGuard.InRange(HandlingTimeMax, TimeSpan.Zero, minute, "OperatorOptions.HandlingTimeMax");
        OptionGuard.Ordered(
            HandlingTimeMin,
            HandlingTimeMax,
            "OperatorOptions.HandlingTimeMin",
            "OperatorOptions.HandlingTimeMax"
        );
        OptionGuard.InRange(WarmKelvinMin, 0, 30, "OperatorOptions.WarmKelvinMin", "K");
        OptionGuard.InRange(WarmKelvinMax, 0, 30, "OperatorOptions.WarmKelvinMax", "K");
        OptionGuard.Ordered(
            WarmKelvinMin,
            WarmKelvinMax,
            "OperatorOptions.WarmKelvinMin",
            "OperatorOptions.WarmKelvinMax"
        );
        OptionGuard.InRange(MaxDwell, TimeSpan.FromSeconds(1), TimeSpan.FromHours(1), "OperatorOptions.MaxDwell");
        OptionGuard.InRange(ReactionTimeMin, TimeSpan.Zero, minute, "OperatorOptions.ReactionTimeMin");
        OptionGuard.InRange(ReactionTimeMax, TimeSpan.Zero, minute, "OperatorOptions.ReactionTimeMax");
        OptionGuard.Ordered(
            ReactionTimeMin,
            ReactionTimeMax,
            "OperatorOptions.ReactionTimeMin",
            "OperatorOptions.ReactionTimeMax"
        );
        return this;
    }
}
