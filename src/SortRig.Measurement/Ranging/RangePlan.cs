namespace SortRig.Measurement.Ranging;

/// <summary>The range plan of a multi-nominal job.</summary>
/// <param name="Decisions">One decision per request, in request order.</param>
/// <param name="Transfers">One offer per pair of neighbouring ranges used, ascending; empty when all nominals share a
/// range.</param>
public sealed record RangePlan(IReadOnlyList<RangeDecision> Decisions, IReadOnlyList<RangeTransfer> Transfers)
{
    /// <summary>True when every nominal is resolvable on its own range.</summary>
    public bool AllResolvable => Decisions.All(d => d.Verdict == RangeVerdict.Resolvable);

    /// <summary>True when the nominals sit on more than one range (ratios across ranges carry the gain
    /// uncertainty).</summary>
    public bool SpansRanges => Transfers.Count > 0;
}
