namespace SortRig.Engine.Sorting;

/// <summary>How a sorting session places parts (Sort:Assigner, --assigner).</summary>
public enum AssignerKind
{
    /// <summary>Fixed bands of the match width around the nominal (the default).</summary>
    Bands,

    /// <summary>Band edges placed where the reel's values fall, learned from the first parts.</summary>
    Adaptive,

    /// <summary>Numbered tray slots, for exact-value set assembly with the plan verb.</summary>
    Slots,
}
