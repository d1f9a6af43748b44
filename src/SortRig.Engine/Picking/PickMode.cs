namespace SortRig.Engine.Picking;

/// <summary>How the pick list names parts.</summary>
internal enum PickMode
{
    /// <summary>By cup and count when every offered part sits in a shared cup and the recipe is matched; else by
    /// part.</summary>
    Auto,

    /// <summary>Each part by id and location (slot, storage location or cup), from the set assembler on exact
    /// values.</summary>
    Parts,

    /// <summary>By cup and count (matched recipes only): any parts of the named cups make the set.</summary>
    Cups,
}
