using System.CommandLine;
using Microsoft.Extensions.Logging;
using Serilog;
using SortRig.Simulator;
using SortRig.Simulator.Faults;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Physics;

namespace SortRig.Host.Cli;

/// <summary>The simulate verb: the simulated bench meter as a standalone SCPI device.</summary>
internal static class SimulateCommand
{
    public static Command Create()
    {
        var command = new Command(
            "simulate",
            "Run the simulated bench meter on 127.0.0.1 (TCP) or a serial device until stopped."
        );
        var port = new Option<int>("--port")
        {
            Description = "TCP port on 127.0.0.1 (default 5025; 0 picks a free one)",
            DefaultValueFactory = _ => 5025,
        };
        var serial = new Option<string?>("--serial")
        {
            Description = "Also serve on this serial device (e.g. one end of a socat pty pair)",
        };
        var seed = new Option<int>("--seed")
        {
            Description = "Random seed (default 2026)",
            DefaultValueFactory = _ => 2026,
        };
        var parts = new Option<int>("--parts")
        {
            Description = "Parts on the reel (default 200)",
            DefaultValueFactory = _ => 200,
        };
        var speed = new Option<double>("--speed")
        {
            Description = "Virtual time runs this many times faster (default 1)",
            DefaultValueFactory = _ => 1,
        };
        var manual = new Option<bool>("--manual")
        {
            Description = "No virtual operator: parts go in and out only by the SIMulation:FIXTure commands",
        };
        var faults = new Option<double>("--faults")
        {
            Description = "Faults per exchange of each kind (0..0.5, default 0)",
        };
        command.Add(port);
        command.Add(serial);
        command.Add(seed);
        command.Add(parts);
        command.Add(speed);
        command.Add(manual);
        command.Add(faults);
        command.SetAction(
            async (result, ct) =>
            {
                var rate = result.GetValue(faults);
                var options = new SimulatedBenchOptions
                {
                    Seed = result.GetValue(seed),
                    TcpPort = result.GetValue(port),
                    SerialPath = result.GetValue(serial),
                    TimeScale = result.GetValue(speed),
                    Reel = new ReelSpec { Count = result.GetValue(parts) },
                    Operator = new OperatorOptions
                    {
                        Mode = result.GetValue(manual) ? OperatorMode.Manual : OperatorMode.Auto,
                    },
                    Faults = new FaultOptions
                    {
                        DropRate = rate,
                        DelayRate = rate,
                        GarbleRate = rate,
                        SpuriousErrorRate = rate,
                        SilentResetRate = rate,
                    },
                };
                using var serilog = new LoggerConfiguration()
                    .MinimumLevel.Information()
                    .WriteTo.Console(formatProvider: System.Globalization.CultureInfo.InvariantCulture)
                    .CreateLogger();
                using var loggers = LoggerFactory.Create(b => b.AddSerilog(serilog));
                Console.Error.WriteLine(
                    $"simulated meter: TCPIP::127.0.0.1::{options.TcpPort}::SOCKET"
                        + $"{(options.SerialPath is null ? "" : " and " + options.SerialPath)} (Ctrl+C stops)"
                );
                try
                {
                    await SimulatedBench.RunStandaloneAsync(options, loggers, null, ct).ConfigureAwait(false);
                }
                catch (OperationCanceledException) when (ct.IsCancellationRequested)
                {
                    // Stopped by Ctrl+C.
                }

                return 0;
            }
        );
        return command;
    }
}
