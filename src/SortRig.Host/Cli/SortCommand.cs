using System.CommandLine;
using Microsoft.AspNetCore.Builder;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Engine.Typed;
using SortRig.Host.Hosting;
using SortRig.Host.Operator;
using SortRig.Host.Web;
using SortRig.Instruments.Resources;
using SortRig.Simulator;

namespace SortRig.Host.Cli;

/// <summary>The sort verb: hands-free sorting, on the embedded simulator when no resource is given.</summary>
internal static class SortCommand
{
    public static Command Create()
    {
        var command = new Command(
            "sort",
            "Sort parts hands-free: settle, log, announce the cup. Without --resource, runs the built-in simulator "
                + "with a demo reel. Before wiring a bench read docs/safety.md (ESD, hot parts, solvents)."
        );
        var map = new FlagMap();
        map.Add(
            command,
            new Option<string>("--resource")
            {
                Description =
                    "Meter resource, e.g. TCPIP::192.0.2.10::5025::SOCKET or ASRL::/dev/ttyUSB0::INSTR; omit for the "
                    + "simulator",
            },
            "Sort:Resource"
        );
        map.Add(
            command,
            new Option<string>("--profile")
            {
                Description = "Meter profile name under instruments/ or a YAML file (default simulator)",
            },
            "Sort:Profile"
        );
        map.Add(
            command,
            new Option<string>("--db")
            {
                Description = "SQLite file or PostgreSQL connection string (default sortrig.db)",
            },
            "Sort:Database"
        );
        map.Add(
            command,
            new Option<string>("--session")
            {
                Description = "Session name; the same name resumes an unfinished session (default bench)",
            },
            "Sort:Session"
        );
        map.Add(
            command,
            new Option<double>("--nominal")
            {
                Description = "Nominal value in ohms: 10000, 10k, 4.99k, 1M (default 10k)",
                CustomParser = TradeValueParser.Ohms,
            },
            "Sort:Nominal"
        );
        map.Add(
            command,
            new Option<double>("--tolerance")
            {
                Description = "Stock tolerance: 0.01, 1% or 10000ppm (default 1%)",
                CustomParser = TradeValueParser.Fraction,
            },
            "Sort:StockTolerance"
        );
        map.Add(
            command,
            new Option<double>("--match")
            {
                Description = "Match tolerance: 0.001, 0.1% or 1000ppm (default 0.1%)",
                CustomParser = TradeValueParser.Fraction,
            },
            "Sort:MatchTolerance"
        );
        map.Add(
            command,
            new Option<int>("--cups") { Description = "Cups besides the reject cup (default 12)" },
            "Sort:Cups"
        );
        map.Add(
            command,
            new Option<string>("--assigner")
            {
                Description = "bands (default), adaptive (edges learned from the reel) or slots (numbered tray slots)",
            },
            "Sort:Assigner"
        );
        map.Add(
            command,
            new Option<double>("--nplc") { Description = "Integration time in power-line cycles (default 1)" },
            "Sort:Nplc"
        );
        map.Add(
            command,
            new Option<string>("--bridge")
            {
                Description =
                    "Range transfer for a batch on another range than the session's first: auto (when the match "
                    + "needs it, default), always, off",
            },
            "Sort:Bridge"
        );
        map.Add(
            command,
            new Option<string>("--check")
            {
                Description =
                    "Check standard read at the start, on a cadence and at the end, kept on a control chart: "
                    + "fixture:OHMS (a reference part kept at the fixture) or library:PART_ID (docs/checking.md); "
                    + "default none",
            },
            "Sort:Check"
        );
        map.Add(
            command,
            new Option<int>("--check-every")
            {
                Description = "Parts between two checks (default 25; 0 for none, then give --check-minutes)",
            },
            "Sort:CheckEvery"
        );
        map.Add(
            command,
            new Option<double>("--check-minutes")
            {
                Description =
                    "Minutes between two checks, whichever of this and --check-every comes first (default 0: none)",
            },
            "Sort:CheckMinutes"
        );
        map.Add(
            command,
            new Option<double>("--check-value")
            {
                Description =
                    "The check's calibrated value in ohms (10000, 10k), for the meter's apparent gain; a library "
                    + "check uses its logged value",
                CustomParser = TradeValueParser.Ohms,
            },
            "Sort:CheckValue"
        );
        map.Add(
            command,
            new Option<string>("--settle")
            {
                Description =
                    "Settle rule: predictive (default: fits each part's cooling and may accept earlier; the averaging "
                    + "rule decides when no fit does; holds the false-accept bound over many simulated reels, see "
                    + "docs/bench-settle.md) or averaging (waits until the readings stop moving)",
            },
            "Sort:Settle"
        );
        map.Add(
            command,
            new Option<bool>("--reopen")
            {
                Description =
                    "Carry on the latest session of this name even if finished (another batch of the same job; "
                    + "--parts counts the whole session)",
            },
            "Sort:Reopen"
        );
        map.Add(command, new Option<bool>("--four-wire") { Description = "Measure 4-wire" }, "Sort:FourWire");
        map.Add(
            command,
            new Option<int>("--parts")
            {
                Description = "Stop after this many parts; on the simulator the demo reel's length (default 60)",
            },
            "Sort:Parts"
        );
        map.Add(
            command,
            new Option<int>("--agree")
            {
                Description =
                    "Typed meter (TYPED::profile): entries in a row, a few seconds apart, that must agree within one "
                    + "digit (default 2)",
            },
            "Sort:Agree"
        );
        map.Add(
            command,
            new Option<double>("--gap")
            {
                Description = "Typed meter: least seconds between two counted entries (default 3)",
            },
            "Sort:Gap"
        );
        map.Add(
            command,
            new Option<string>("--recipe")
            {
                Description =
                    "Sort toward a build: recipe file or name under recipes/; the session stops as soon as --sets "
                    + "sets can be formed from the parts measured",
            },
            "Sort:Recipe"
        );
        map.Add(
            command,
            new Option<int>("--sets") { Description = "Sets of --recipe to sort toward (default 1, at most 64)" },
            "Sort:Sets"
        );
        map.Add(
            command,
            new Option<string>("--sets-csv")
            {
                Description = "Where to export the pick list once the sets are in hand (default SESSION-sets.csv here)",
            },
            "Sort:SetsCsv"
        );
        map.Add(
            command,
            new Option<int>("--seed") { Description = "Simulator: seed of the demo reel (default 2026)" },
            "Sort:Seed"
        );
        map.Add(
            command,
            new Option<string>("--physics")
            {
                Description =
                    "Simulator: bench physics of the demo reel, simple (default) or rich (two cooling paths, "
                    + "self-heating, excess and popcorn noise)",
            },
            "Sort:Physics"
        );
        map.Add(
            command,
            new Option<double>("--speed")
            {
                Description = "Simulator: run virtual time this many times faster (default 1)",
            },
            "Sort:Speed"
        );
        map.Add(
            command,
            new Option<bool>("--plain") { Description = "No live view: one plain line per announcement" },
            "Sort:Live"
        );
        map.Add(command, new Option<bool>("--no-speech") { Description = "Do not speak announcements" }, "Sort:Speech");
        map.Add(
            command,
            new Option<bool>("--web") { Description = "Serve the bench page (default http://127.0.0.1:5080)" },
            "Web:Enabled"
        );
        map.Add(
            command,
            new Option<bool>("--stay") { Description = "Keep serving the page after the session ends, until Ctrl+C" },
            "Sort:StayAfterFinish"
        );
        map.Add(
            command,
            new Option<string>("--web-urls")
            {
                Description = "Where the page listens; non-loopback needs SORTRIG_Web__Token",
            },
            "Web:Urls"
        );
        command.SetAction((result, ct) => RunAsync(map.Overrides(result), map, ct));
        return command;
    }

    public static Task<int> RunAsync(Dictionary<string, string?> flags, CancellationToken ct) =>
        RunAsync(flags, null, ct);

    /// <param name="flags">Configuration overrides from the flags given.</param>
    /// <param name="names">The flags' names, so a bad value is reported as the user typed it.</param>
    /// <param name="ct">Stops the session (Ctrl+C).</param>
    public static async Task<int> RunAsync(Dictionary<string, string?> flags, FlagMap? names, CancellationToken ct)
    {
        // --plain and --no-speech are negative flags: turn them into the options they negate.
        if (flags.Remove("Sort:Live", out var plain) && plain == "True")
        {
            flags["Sort:Live"] = "false";
        }

        if (flags.Remove("Sort:Speech", out var mute) && mute == "True")
        {
            flags["Sort:Speech"] = "false";
        }

        var live = !flags.TryGetValue("Sort:Live", out var l) || l != "false";
        var builder = HostSetup.CreateBuilder(flags, quietConsole: live);
        builder
            .Services.AddOptions<SortOptions>()
            .Bind(builder.Configuration.GetSection(SortOptions.Section))
            .ValidateDataAnnotations()
            .ValidateOnStart();
        var (sort, problem) = SortInputCheck.Bind(builder.Configuration, names);
        if (sort is null)
        {
            await Console.Error.WriteLineAsync($"error: {problem}").ConfigureAwait(false);
            return ParseErrors.BadInput;
        }

        if (sort.Recipe.Length > 0)
        {
            // resolved to its full path
            builder.Configuration[$"{SortOptions.Section}:{nameof(SortOptions.Recipe)}"] = sort.Recipe;
        }

        TimeProvider time = sort.Speed == 1 ? TimeProvider.System : new ScaledTimeProvider(sort.Speed);
        builder.Services.AddSingleton(time);
        builder.Services.AddSingleton<BenchEventHub>();
        builder.Services.AddSingleton<BenchSnapshot>();
        builder.Services.AddSingleton<OperatorCommands>();
        builder.Services.AddSingleton<SortWorker>();
        builder.Services.AddHostedService(sp => sp.GetRequiredService<SortWorker>());
        builder.Services.AddSingleton<TypedEntries>();
        if (!ResourceStringParser.IsTyped(sort.Resource))
        {
            // A typed meter reads whole lines from the console (TypedConsole); single keys would steal them.
            builder.Services.AddHostedService(sp => new KeyboardInput(
                sp.GetRequiredService<OperatorCommands>(),
                TimeProvider.System
            ));
        }

        var host = HostSetup.Build(builder);

        var worker = host.Services.GetRequiredService<SortWorker>();
        await host.RunAsync(ct).ConfigureAwait(false);
        return worker.ExitCode;
    }
}
