namespace SortRig.Simulator.Scpi;

/// <summary>One command or query of a program message (the text between semicolons), parsed.</summary>
/// <param name="Rooted">The header started with ':' (resolve from the root, not the current path).</param>
/// <param name="Nodes">Header mnemonics as typed, without ':' and '?'; for a common command the single name with
/// '*'.</param>
/// <param name="IsQuery">The header ended with '?'.</param>
/// <param name="Parameters">Parameters as typed, trimmed, in order.</param>
internal sealed record ProgramUnit(
    bool Rooted,
    IReadOnlyList<string> Nodes,
    bool IsQuery,
    IReadOnlyList<string> Parameters
)
{
    public bool IsCommon => Nodes.Count == 1 && Nodes[0].StartsWith('*');
}
