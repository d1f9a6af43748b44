namespace SortRig.Simulator.Scpi;

/// <summary>
/// Per-connection parser state: the current header path for units after a ';' (SCPI-99 vol. 1
/// sec. 6.2.4). Reset at every new program message.
/// </summary>
internal sealed class ScpiSession
{
    public IReadOnlyList<string> Path { get; private set; } = [];

    public void ResetPath() => Path = [];

    /// <summary>After a command with these full tokens, the path is all but the last node.</summary>
    public void Advance(IReadOnlyList<string> fullTokens) => Path = fullTokens.Take(fullTokens.Count - 1).ToArray();
}
