namespace SortRig.Simulator.Scpi;

/// <summary>
/// A header in the command tree, written with ':' between nodes and optional nodes in brackets:
/// "[SENSe]:RESistance:NPLCycles", "SYSTem:ERRor:[NEXT]", or a common command "*IDN".
/// </summary>
internal sealed class HeaderPattern
{
    private readonly (Mnemonic Node, bool Optional)[] _nodes;

    public HeaderPattern(string pattern)
    {
        Text = pattern;
        _nodes = pattern
            .Split(':')
            .Select(n => n.StartsWith('[') ? (new Mnemonic(n.Trim('[', ']')), true) : (new Mnemonic(n), false))
            .ToArray();
    }

    public string Text { get; }

    public bool Matches(IReadOnlyList<string> tokens) => Match(tokens, 0, 0);

    private bool Match(IReadOnlyList<string> tokens, int i, int j)
    {
        if (j == _nodes.Length)
        {
            return i == tokens.Count;
        }

        var (node, optional) = _nodes[j];
        if (i < tokens.Count && node.Matches(tokens[i]) && Match(tokens, i + 1, j + 1))
        {
            return true;
        }

        return optional && Match(tokens, i, j + 1);
    }
}
