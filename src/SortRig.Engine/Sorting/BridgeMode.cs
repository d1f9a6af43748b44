namespace SortRig.Engine.Sorting;

/// <summary>When a range transfer measures a bridging part (Sort:Bridge, --bridge). See
/// docs/range-transfer.md.</summary>
public enum BridgeMode
{
    /// <summary>When the two ranges' gain uncertainty does not fit the match band (the default).</summary>
    Auto,

    /// <summary>Whenever the batch's range differs from the session's first.</summary>
    Always,

    /// <summary>Never; ratios across the ranges then carry the gain error.</summary>
    Off,
}
