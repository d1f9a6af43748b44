namespace SortRig.Measurement.Settling;

/// <summary>
/// What the session's parts so far say about the body's thermal time constant of the reel's parts: an empirical-Bayes
/// prior for the predictive rule (docs/bench-settle.md, seventh pass). Parts of one reel share one package, so their
/// body time constants (mass over surface) lie within a narrow spread. A part whose own record resolved its body
/// (<see cref="RecoveryFit.BodyResolved"/>: a clean fit over a record of at least twice the assumed longest time
/// constant, standard error at most 5 % of the estimate) adds its estimate; other parts change nothing. Once
/// <see cref="MinParts"/> parts have, <see cref="BodyRange"/> spans their estimates, widened on each side by the
/// expected gap between the extreme of n exchangeable draws and the population's own extreme (range / (n − 1): for a
/// uniform population the gap's mean is range / (n + 1); order statistics, from memory) and by twice the largest
/// standard error among them (the extreme estimate may itself be off by that much). The predictive rule then holds the
/// body at or above the range's floor, keeps the assumed longest time constant as its upper bound, makes its interval
/// hold the best fits' asymptotes across the whole range, and refuses the range for a part whose record says it does
/// not belong (a likelihood-ratio test). Immutable: <see cref="Learn"/> gives the next prior; the sort's tracker
/// carries it from part to part.
/// </summary>
/// <param name="Count">Parts whose resolved body estimates were learned.</param>
/// <param name="Lowest">Lowest resolved body time constant, s (∞ when none).</param>
/// <param name="Highest">Highest resolved body time constant, s (−∞ when none).</param>
/// <param name="LargestError">Largest standard error among them, s.</param>
/// <param name="Seen">Parts accepted in the session, resolved or not.</param>
/// <param name="SumLog">Sum of the resolved estimates' ln τ.</param>
/// <param name="SumSquaresLog">Sum of their squares.</param>
public sealed record ReelPrior(
    int Count,
    double Lowest,
    double Highest,
    double LargestError,
    int Seen = 0,
    double SumLog = 0,
    double SumSquaresLog = 0
)
{
    /// <summary>
    /// Resolved parts before the floor is used: with 20 exchangeable draws the chance that the next lies below the
    /// lowest of them is 1/21, about 5 % (distribution-free), and the margin takes most of that; a part a little below
    /// the floor is biased only a little (the recovery left times its shortfall in time constant) and its record may
    /// refuse the floor (common practice, no source).
    /// </summary>
    public const int MinParts = 20;

    /// <summary>No part seen: the wide prior.</summary>
    public static ReelPrior Empty { get; } = new(0, double.PositiveInfinity, double.NegativeInfinity, 0);

    /// <summary>
    /// The learned range of the body time constant, s: the resolved estimates' range widened on each side; null
    /// before <see cref="MinParts"/> parts.
    /// </summary>
    public (double Floor, double Ceiling)? BodyRange
    {
        get
        {
            if (Count < MinParts)
            {
                return null;
            }

            var margin = ((Highest - Lowest) / (Count - 1)) + (2 * LargestError);
            return (Lowest - margin, Highest + margin);
        }
    }

    /// <summary>
    /// The learned distribution of the next part's ln τ_body (<see cref="BodyPrior"/>: Student's t of the resolved
    /// estimates' mean and spread, n − 1 degrees of freedom); null before <see cref="MinParts"/> parts. The estimates'
    /// spread holds their own errors as well as the reel's spread, which only widens it.
    /// </summary>
    public BodyPrior? Body
    {
        get
        {
            if (Count < MinParts)
            {
                return null;
            }

            var mean = SumLog / Count;
            var variance = Math.Max(SumSquaresLog - (Count * mean * mean), 0) / (Count - 1);
            return new BodyPrior(mean, Math.Sqrt(variance * (1 + (1.0 / Count))), Count - 1);
        }
    }

    /// <summary>
    /// The prior after one more accepted part: its fit's body estimate is added when the record resolved it
    /// (<see cref="RecoveryFit.BodyResolved"/>); otherwise the prior is unchanged.
    /// </summary>
    public ReelPrior Learn(RecoveryFit? fit) =>
        fit is { BodyResolved: true, BodyTimeConstant: var tau, BodyStandardError: var se }
            ? new ReelPrior(
                Count + 1,
                Math.Min(Lowest, tau),
                Math.Max(Highest, tau),
                Math.Max(LargestError, se),
                Seen + 1,
                SumLog + Math.Log(tau),
                SumSquaresLog + (Math.Log(tau) * Math.Log(tau))
            )
            : this with
            {
                Seen = Seen + 1,
            };
}
