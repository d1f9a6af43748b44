using System.CommandLine;
using System.CommandLine.Help;
using SortRig.Host.Cli;

namespace SortRig.Host;

internal static class Program
{
    public static async Task<int> Main(string[] args)
    {
        var parse = Parse(args);
        return ParseErrors.Report(parse, Console.Error)
            ? ParseErrors.BadInput
            : await parse.InvokeAsync().ConfigureAwait(false);
    }

    /// <summary>
    /// Parses the command line. An argument starting with '@' is a value like any other ("--at @bag 7"),
    /// never a file of arguments to read.
    /// </summary>
    public static ParseResult Parse(IReadOnlyList<string> args)
    {
        // Named as README and help call the program (scripts/sortrig), not after the assembly.
        var root = new Command(
            "sortrig",
            "SortRig: sorts and matches resistors at the bench through a SCPI multimeter."
        )
        {
            new HelpOption(),
            new VersionOption(),
            SortCommand.Create(),
            ProbeCommand.Create(),
            SimulateCommand.Create(),
            PlanCommand.Create(),
            LibraryCommand.Create(),
            DriftCommand.Create(),
            ReportCommand.Create(),
            OrderCommand.Create(),
            ReachCommand.Create(),
        };
        DbPasswordGuard.Attach(root);
        return root.Parse(args, new ParserConfiguration { ResponseFileTokenReplacer = null });
    }
}
