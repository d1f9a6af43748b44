using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Scpi;

/// <summary>The command tree: finds the entry for a header, or says why none fits.</summary>
internal sealed class CommandTable
{
    private readonly List<ScpiCommand> _commands = [];

    public IReadOnlyList<ScpiCommand> Commands => _commands;

    /// <summary>Adds a command (no '?') or a query (pattern ending in '?').</summary>
    public CommandTable Add(string pattern, ScpiHandler handler, int minParameters = 0, int maxParameters = 0)
    {
        var isQuery = pattern.EndsWith('?');
        var header = new HeaderPattern(isQuery ? pattern[..^1] : pattern);
        _commands.Add(new ScpiCommand(header, isQuery, minParameters, maxParameters, handler));
        return this;
    }

    /// <summary>
    /// The entry for these header tokens in this form; -113 when no header matches, -100 when the
    /// header exists only in the other form (command vs query).
    /// </summary>
    public ScpiCommand? Find(IReadOnlyList<string> tokens, bool isQuery, out ScpiError? error)
    {
        var matches = _commands.Where(c => c.Header.Matches(tokens)).ToList();
        var exact = matches.FirstOrDefault(c => c.IsQuery == isQuery);
        error =
            exact is not null ? null
            : matches.Count > 0 ? ScpiError.Command
            : ScpiError.UndefinedHeader;
        return exact;
    }
}
