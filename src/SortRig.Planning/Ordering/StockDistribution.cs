using MathNet.Numerics.Distributions;

namespace SortRig.Planning.Ordering;

/// <summary>Shape of a stock's values around the marked nominal.</summary>
public enum StockShape
{
    /// <summary>Normal with σ = tolerance / 3, truncated to ± the tolerance.</summary>
    Normal,

    /// <summary>Uniform over ± the tolerance.</summary>
    Uniform,

    /// <summary>Normal with σ = tolerance / 2, truncated to ± the tolerance, with |deviation| &lt; gap missing (the
    /// centre was sold as a tighter grade).</summary>
    Bimodal,

    /// <summary>Resampled (with replacement) from measured relative deviations.</summary>
    Empirical,
}

/// <summary>
/// How the relative deviations (value / nominal − 1) of bought parts are distributed. Immutable; draws are repeatable
/// for a given <see cref="Random"/>.
/// </summary>
public sealed record StockDistribution
{
    private readonly double[] _measured;

    private StockDistribution(StockShape shape, double tolerance, double gap, double[] measured)
    {
        if (shape != StockShape.Empirical && !(tolerance is > 0 and <= 0.5))
        {
            throw new ArgumentOutOfRangeException(
                nameof(tolerance),
                tolerance,
                "stock tolerance must be > 0 and at most 0.5 (50 %)"
            );
        }

        Shape = shape;
        Tolerance = tolerance;
        Gap = gap;
        _measured = measured;
    }

    /// <summary>The shape.</summary>
    public StockShape Shape { get; }

    /// <summary>Stock tolerance, a fraction (0.01 = 1 %); for an empirical stock the largest |deviation|
    /// measured.</summary>
    public double Tolerance { get; }

    /// <summary>Bimodal only: half-width of the missing centre, a fraction; 0 otherwise.</summary>
    public double Gap { get; }

    /// <summary>Empirical only: the measured relative deviations; empty otherwise.</summary>
    public IReadOnlyList<double> Measured => _measured;

    /// <summary>Normal stock: σ = tolerance / 3, truncated at ± tolerance (common practice, no source).</summary>
    /// <param name="tolerance">Stock tolerance, fraction, (0, 0.5].</param>
    public static StockDistribution Normal(double tolerance) => new(StockShape.Normal, tolerance, 0, []);

    /// <summary>Uniform stock over ± tolerance.</summary>
    /// <param name="tolerance">Stock tolerance, fraction, (0, 0.5].</param>
    public static StockDistribution Uniform(double tolerance) => new(StockShape.Uniform, tolerance, 0, []);

    /// <summary>Bimodal stock: σ = tolerance / 2, truncated at ± tolerance, |deviation| &lt; gap removed.</summary>
    /// <param name="tolerance">Stock tolerance, fraction, (0, 0.5].</param>
    /// <param name="gapFraction">Missing centre as a fraction of the tolerance, 0 to 0.9; default 0.4.</param>
    public static StockDistribution Bimodal(double tolerance, double gapFraction = 0.4) =>
        gapFraction is >= 0 and <= 0.9
            ? new(StockShape.Bimodal, tolerance, gapFraction * tolerance, [])
            : throw new ArgumentOutOfRangeException(
                nameof(gapFraction),
                gapFraction,
                "the missing centre must be 0 to 0.9 of the tolerance"
            );

    /// <summary>Resamples measured relative deviations.</summary>
    /// <param name="deviations">At least 2 finite deviations, each within ± 0.5.</param>
    public static StockDistribution Empirical(IEnumerable<double> deviations)
    {
        ArgumentNullException.ThrowIfNull(deviations);
        var d = deviations.ToArray();
        if (d.Length < 2 || d.Any(x => !double.IsFinite(x) || Math.Abs(x) > 0.5))
        {
            throw new ArgumentException(
                "an empirical stock needs at least 2 measured deviations, each finite and within ±50 %",
                nameof(deviations)
            );
        }

        return new StockDistribution(StockShape.Empirical, d.Max(Math.Abs), 0, d);
    }

    /// <summary>Draws one relative deviation.</summary>
    /// <param name="random">The trial's generator.</param>
    public double Draw(Random random)
    {
        ArgumentNullException.ThrowIfNull(random);
        switch (Shape)
        {
            case StockShape.Uniform:
                return ContinuousUniform.Sample(random, -Tolerance, Tolerance);
            case StockShape.Empirical:
                return _measured[random.Next(_measured.Length)];
            default:
                var sigma = Shape == StockShape.Normal ? Tolerance / 3 : Tolerance / 2;
                while (true)
                {
                    var x = MathNet.Numerics.Distributions.Normal.Sample(random, 0, sigma);
                    if (Math.Abs(x) <= Tolerance && Math.Abs(x) >= Gap)
                    {
                        return x;
                    }
                }
        }
    }

    /// <inheritdoc />
    public bool Equals(StockDistribution? other) =>
        other is not null
        && Shape == other.Shape
        && Tolerance == other.Tolerance
        && Gap == other.Gap
        && _measured.SequenceEqual(other._measured);

    /// <inheritdoc />
    public override int GetHashCode() => HashCode.Combine(Shape, Tolerance, Gap, _measured.Length);

    /// <summary>Short description, e.g. "normal ±1 %".</summary>
    public string Describe() =>
        Shape switch
        {
            StockShape.Empirical => FormattableString.Invariant(
                $"measured ({_measured.Length} parts, within ±{Tolerance * 100:0.###} %)"
            ),
            StockShape.Bimodal => FormattableString.Invariant(
                $"bimodal ±{Tolerance * 100:0.###} % without the centre ±{Gap * 100:0.###} %"
            ),
            _ => FormattableString.Invariant($"{Shape.ToString().ToLowerInvariant()} ±{Tolerance * 100:0.###} %"),
        };
}
