using System.CommandLine;
using SortRig.Host.Cli;

namespace SortRig.Host;

internal static class Program
{
    public static async Task<int> Main(string[] args)
    {
        var root = new RootCommand("SortRig: sorts and matches resistors at the bench through a SCPI multimeter.")
        {
            SortCommand.Create(),
            ProbeCommand.Create(),
            SimulateCommand.Create(),
            PlanCommand.Create(),
            LibraryCommand.Create(),
            DriftCommand.Create(),
            ReportCommand.Create(),
        };
        var parse = root.Parse(args);
        return ParseErrors.Report(parse, Console.Error)
            ? ParseErrors.BadInput
            : await parse.InvokeAsync().ConfigureAwait(false);
    }
}
