using System.CommandLine;
using Microsoft.AspNetCore.Builder;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using SortRig.Engine.DriftLogging;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Simulation;
using SortRig.Engine.Sorting;
using SortRig.Host.Hosting;
using SortRig.Host.LibraryVerb;
using SortRig.Host.Operator;
using SortRig.Host.VerbSupport;
using SortRig.Host.Web;
using SortRig.Simulator;

namespace SortRig.Host.Cli;

/// <summary>The drift verb: an overnight drift log of parts on scanner channels, with a Pt100 for the
/// temperature.</summary>
internal static class DriftCommand
{
    public static Command Create()
    {
        var command = new Command(
            "drift",
            "Log the drift of parts on scanner channels for hours, with the temperature from a Pt100. Without "
                + "--resource, runs the built-in simulator with parts loaded. Unattended runs: see docs/safety.md."
        );
        var map = new FlagMap();
        map.Add(
            command,
            new Option<string>("--resource")
            {
                Description =
                    "Meter resource with a scanner, e.g. TCPIP::192.0.2.10::5025::SOCKET; omit for the simulator",
            },
            "Drift:Resource"
        );
        map.Add(
            command,
            new Option<string>("--profile")
            {
                Description = "Meter profile name under instruments/ or a YAML file (default simulator)",
            },
            "Drift:Profile"
        );
        map.Add(
            command,
            new Option<string>("--db")
            {
                Description = "SQLite file or PostgreSQL connection string (default sortrig.db)",
            },
            "Drift:Database"
        );
        map.Add(
            command,
            new Option<string>("--run") { Description = "Name of the drift run (default overnight)" },
            "Drift:Run"
        );
        map.Add(
            command,
            new Option<string>("--channels") { Description = "Part channels, e.g. 101-104,107 (default 101-104)" },
            "Drift:Channels"
        );
        map.Add(
            command,
            new Option<string>("--library-parts")
            {
                Description =
                    "Library parts on the channels, channel=part: 101=17,102=#18,103-104=20-21 (ids or #id as on the "
                    + "printed label)",
            },
            "Drift:LibraryParts"
        );
        map.Add(
            command,
            new Option<int>("--pt100")
            {
                Description =
                    "Pt100 channel; 0 for none (default: the channel after the highest part channel, 105 for 101-104)",
            },
            "Drift:Pt100Channel"
        );
        map.Add(
            command,
            new Option<double>("--interval") { Description = "Seconds between scans (default 60)" },
            "Drift:IntervalSeconds"
        );
        map.Add(
            command,
            new Option<double>("--hours")
            {
                Description = "Length of the run in hours; 0 logs until Ctrl+C (default 12)",
            },
            "Drift:Hours"
        );
        map.Add(
            command,
            new Option<double>("--range")
            {
                Description = "Range full scale in ohms for every channel (default 10000)",
            },
            "Drift:Range"
        );
        map.Add(
            command,
            new Option<double>("--nplc") { Description = "Integration time in power-line cycles (default 10)" },
            "Drift:Nplc"
        );
        map.Add(
            command,
            new Option<bool>("--two-wire") { Description = "Measure 2-wire (default 4-wire)" },
            "Drift:FourWire"
        );
        map.Add(
            command,
            new Option<int>("--batch") { Description = "Most samples per storage transaction (default 64)" },
            "Drift:BatchSize"
        );
        map.Add(
            command,
            new Option<string>("--notes") { Description = "Free text stored with the run" },
            "Drift:Notes"
        );
        map.Add(
            command,
            new Option<int>("--seed") { Description = "Simulator: seed of the parts and the room (default 2026)" },
            "Drift:Seed"
        );
        map.Add(
            command,
            new Option<double>("--speed") { Description = "Simulator: run time this many times faster (default 1)" },
            "Drift:Speed"
        );
        map.Add(
            command,
            new Option<bool>("--virtual")
            {
                Description = "Simulator: run in pure virtual time, as fast as the machine allows",
            },
            "Drift:Virtual"
        );
        map.Add(
            command,
            new Option<bool>("--web")
            {
                Description = "Serve the bench page with the live samples (default http://127.0.0.1:5080)",
            },
            "Web:Enabled"
        );
        map.Add(
            command,
            new Option<string>("--web-urls")
            {
                Description = "Where the page listens; non-loopback needs SORTRIG_Web__Token",
            },
            "Web:Urls"
        );
        command.SetAction((result, ct) => RunAsync(map.Overrides(result), ct));
        return command;
    }

    public static async Task<int> RunAsync(Dictionary<string, string?> flags, CancellationToken ct)
    {
        // --two-wire is a negative flag: turn it into the option it negates.
        if (flags.Remove("Drift:FourWire", out var twoWire) && twoWire == "True")
        {
            flags["Drift:FourWire"] = "false";
        }

        var builder = HostSetup.CreateBuilder(flags, quietConsole: false);
        builder.Services.AddOptions<DriftOptions>().Bind(builder.Configuration.GetSection(DriftOptions.Section));
        var options = builder.Configuration.GetSection(DriftOptions.Section).Get<DriftOptions>() ?? new DriftOptions();
        DriftSettings settings;
        try
        {
            settings = options.Validate();
        }
        catch (ArgumentException e)
        {
            await Console.Error.WriteLineAsync($"drift: {e.Message.Split(" (Parameter", 2)[0]}").ConfigureAwait(false);
            return VerbExit.BadInput;
        }

        TimeProvider time = settings.Speed switch
        {
            0 => new VirtualClock(TimeProvider.System.GetUtcNow()),
            1 => TimeProvider.System,
            var s => new ScaledTimeProvider(s),
        };
        builder.Services.AddSingleton(time);
        builder.Services.AddSingleton<BenchEventHub>();
        builder.Services.AddSingleton<BenchSnapshot>();
        builder.Services.AddSingleton<OperatorCommands>();
        builder.Services.AddSingleton<DriftWorker>();
        builder.Services.AddHostedService(sp => sp.GetRequiredService<DriftWorker>());

        var host = HostSetup.Build(builder);

        var worker = host.Services.GetRequiredService<DriftWorker>();
        await host.RunAsync(ct).ConfigureAwait(false);
        return worker.ExitCode;
    }
}
