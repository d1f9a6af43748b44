using SortRig.Host.Cli;
using SortRig.Simulator;
using Spectre.Console;

namespace SortRig.Host.Tests.Cli;

/// <summary>The README's probe example, against the standalone simulated meter on a real socket.</summary>
public sealed class ProbeCommandTests
{
    [Fact]
    public async Task Probe_SimulatorProfileAgainstSimulator_Fits()
    {
        await using var bench = new SimulatedBench(new SimulatedBenchOptions { TcpPort = 0 });
        var endpoint = await bench.StartTcpAsync(0, default);
        var output = new StringWriter();
        var console = AnsiConsole.Create(
            new AnsiConsoleSettings { Out = new AnsiConsoleOutput(output), ColorSystem = ColorSystemSupport.NoColors }
        );

        var rc = await ProbeCommand.RunAsync(
            $"TCPIP::127.0.0.1::{endpoint.Port}::SOCKET",
            "simulator",
            console,
            default
        );

        Assert.Equal(0, rc);
        Assert.Contains("profile fits", output.ToString(), StringComparison.Ordinal);
        Assert.Contains("SIM-6H", output.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Probe_BadResource_SaysWhichPartIsWrong()
    {
        var output = new StringWriter();
        var console = AnsiConsole.Create(
            new AnsiConsoleSettings { Out = new AnsiConsoleOutput(output), ColorSystem = ColorSystemSupport.NoColors }
        );

        var rc = await ProbeCommand.RunAsync("TCPIP::127.0.0.1::notaport::SOCKET", "simulator", console, default);

        Assert.Equal(2, rc);
        Assert.Contains("notaport", output.ToString(), StringComparison.Ordinal);
    }
}
