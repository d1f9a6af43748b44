using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Ranging;

/// <summary>Options of the range rule. Each property is validated when set.</summary>
public sealed record RangeRuleOptions
{
    private readonly int _readingsAveraged = 8;
    private readonly double _uncertaintyRatio = 0.25;
    private readonly double _coverageFactor = 2.0;
    private readonly UncertaintyModel _model = UncertaintyModel.Default;
    private readonly SpecPeriod _gainSpecPeriod = SpecPeriod.Year1;

    /// <summary>The default options.</summary>
    public static RangeRuleOptions Default { get; } = new();

    /// <summary>Readings averaged per part (the settle window), for the noise-of-the-mean term. Default 8; valid [1,
    /// 10000].</summary>
    public int ReadingsAveraged
    {
        get => _readingsAveraged;
        init =>
            _readingsAveraged = value is >= 1 and <= 10_000
                ? value
                : throw new ArgumentOutOfRangeException(
                    nameof(ReadingsAveraged),
                    value,
                    "ReadingsAveraged must be in [1, 10000]."
                );
    }

    /// <summary>
    /// Largest allowed ratio of the expanded transfer uncertainty to the match band half-width
    /// (MatchTolerance × Nominal). Default 0.25 (a 4:1 test uncertainty ratio, common practice, no source); valid (0,
    /// 1].
    /// </summary>
    public double UncertaintyRatio
    {
        get => _uncertaintyRatio;
        init =>
            _uncertaintyRatio = value is > 0 and <= 1
                ? value
                : throw new ArgumentOutOfRangeException(
                    nameof(UncertaintyRatio),
                    value,
                    "UncertaintyRatio must be in (0, 1]."
                );
    }

    /// <summary>Coverage factor k of the expanded uncertainty. Default 2; valid [1, 4].</summary>
    public double CoverageFactor
    {
        get => _coverageFactor;
        init =>
            _coverageFactor = value is >= 1 and <= 4
                ? value
                : throw new ArgumentOutOfRangeException(
                    nameof(CoverageFactor),
                    value,
                    "CoverageFactor must be in [1, 4]."
                );
    }

    /// <summary>Short-term and lead assumptions. Default <see cref="UncertaintyModel.Default"/>; not null.</summary>
    public UncertaintyModel Model
    {
        get => _model;
        init => _model = value ?? throw new ArgumentNullException(nameof(Model), "Model must not be null.");
    }

    /// <summary>Which spec's % of reading terms bound the gain difference between two ranges. Default Year1.</summary>
    public SpecPeriod GainSpecPeriod
    {
        get => _gainSpecPeriod;
        init =>
            _gainSpecPeriod = Enum.IsDefined(value)
                ? value
                : throw new ArgumentOutOfRangeException(
                    nameof(GainSpecPeriod),
                    value,
                    "GainSpecPeriod must be Hours24 or Year1."
                );
    }
}
