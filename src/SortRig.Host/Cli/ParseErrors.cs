using System.CommandLine;

namespace SortRig.Host.Cli;

/// <summary>
/// Reports a command line that does not parse as one line naming the option as typed and where to
/// look, with exit code 2 (bad input), instead of System.CommandLine's help dump and exit code 1.
/// </summary>
internal static class ParseErrors
{
    /// <summary>Exit code for bad input, the same in every verb.</summary>
    public const int BadInput = 2;

    /// <summary>Writes the first parse error and returns true when there is one.</summary>
    public static bool Report(ParseResult parse, TextWriter error)
    {
        if (parse.Errors.Count == 0)
        {
            return false;
        }

        // The whole command path below the root, e.g. "library take".
        var path = new List<string>();
        for (var at = parse.CommandResult; at.Parent is System.CommandLine.Parsing.CommandResult parent; at = parent)
        {
            path.Insert(0, at.Command.Name);
        }

        var verb = string.Concat(path.Select(n => " " + n));
        if (path.Count == 0 && parse.UnmatchedTokens.FirstOrDefault(t => !t.StartsWith('-')) is { } typed)
        {
            // A misspelt verb: say so and list the verbs, rather than "Required command was not provided".
            var verbs = string.Join(", ", parse.CommandResult.Command.Subcommands.Select(c => c.Name));
            error.WriteLine($"error: '{typed}' is not a verb of sortrig; the verbs are {verbs} (sortrig --help)");
            return true;
        }

        error.WriteLine($"error: {parse.Errors[0].Message} (sortrig{verb} --help lists the options)");
        return true;
    }
}
