namespace SortRig.Simulator.Faults;

/// <summary>Random fault rates and fault timings. All rates are probabilities per program message, 0 to 1, default
/// 0.</summary>
public sealed record FaultOptions
{
    /// <summary>Probability per reply of <see cref="FaultKind.DropConnection"/>; 0 to 1. Default 0.</summary>
    public double DropRate { get; init; }

    /// <summary>Probability per reply of <see cref="FaultKind.DelayReply"/>; 0 to 1. Default 0.</summary>
    public double DelayRate { get; init; }

    /// <summary>Probability per reply of <see cref="FaultKind.GarbleReply"/>; 0 to 1. Default 0.</summary>
    public double GarbleRate { get; init; }

    /// <summary>Probability per message of <see cref="FaultKind.SpuriousError"/>; 0 to 1. Default 0.</summary>
    public double SpuriousErrorRate { get; init; }

    /// <summary>Probability per message of <see cref="FaultKind.SilentReset"/>; 0 to 1. Default 0.</summary>
    public double SilentResetRate { get; init; }

    /// <summary>Probability per reading reply of <see cref="FaultKind.NotANumber"/>; 0 to 1. Default 0.</summary>
    public double NotANumberRate { get; init; }

    /// <summary>How long a delayed reply is held back; 0 to 10 min. Default 5 s.</summary>
    public TimeSpan ReplyDelay { get; init; } = TimeSpan.FromSeconds(5);

    /// <summary>How long the serial line stays silent after a drop (input discarded); 0.1 s to 10 min. Default 3
    /// s.</summary>
    public TimeSpan SerialSilence { get; init; } = TimeSpan.FromSeconds(3);

    /// <summary>Throws naming the first invalid option and its valid range.</summary>
    public FaultOptions Validate()
    {
        foreach (var kind in Enum.GetValues<FaultKind>())
        {
            OptionGuard.InRange(RateOf(kind), 0, 1, $"FaultOptions.{kind}Rate");
        }

        OptionGuard.InRange(ReplyDelay, TimeSpan.Zero, TimeSpan.FromMinutes(10), "FaultOptions.ReplyDelay");
        OptionGuard.InRange(
            SerialSilence,
            TimeSpan.FromSeconds(0.1),
            TimeSpan.FromMinutes(10),
            "FaultOptions.SerialSilence"
        );
        return this;
    }

    /// <summary>The configured rate of one kind.</summary>
    public double RateOf(FaultKind kind) =>
        kind switch
        {
            FaultKind.DropConnection => DropRate,
            FaultKind.DelayReply => DelayRate,
            FaultKind.GarbleReply => GarbleRate,
            FaultKind.SpuriousError => SpuriousErrorRate,
            FaultKind.SilentReset => SilentResetRate,
            FaultKind.NotANumber => NotANumberRate,
            _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown fault kind."),
        };
}
