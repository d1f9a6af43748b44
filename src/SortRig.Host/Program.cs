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
        return await root.Parse(args).InvokeAsync().ConfigureAwait(false);
    }
}
