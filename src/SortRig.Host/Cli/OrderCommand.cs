using System.CommandLine;
using SortRig.Host.OrderVerb;
using SortRig.Host.VerbSupport;
using Spectre.Console;

namespace SortRig.Host.Cli;

/// <summary>The order verb: how many parts to buy for N matched sets (Monte Carlo through the set assembler).</summary>
internal static class OrderCommand
{
    public static Command Create(IAnsiConsole? console = null)
    {
        var command = new Command(
            "order",
            "Estimate how many parts to buy for N matched sets of a recipe at 90, 95 and 99 % confidence (seeded "
                + "Monte Carlo through the set assembler), with leftovers, cost, CSV and plot."
        );
        var recipe = CliOptions.Recipe();
        var sets = new Option<int>("--sets") { Description = "Sets to build (1 to 10 000)", Required = true };
        var stock = new Option<string>("--stock")
        {
            Description = "Value distribution of the stock: normal (default), uniform or bimodal (centre missing)",
            DefaultValueFactory = _ => "normal",
        };
        var tolerance = new Option<double>("--tolerance")
        {
            Description = "Stock tolerance: 0.01, 1% or 10000ppm (default 1%)",
            CustomParser = TradeValueParser.Fraction,
            DefaultValueFactory = _ => 0.01,
        };
        var gap = new Option<double>("--gap")
        {
            Description = "Bimodal stock: missing centre as a fraction of the tolerance (default 0.4)",
            DefaultValueFactory = _ => 0.4,
        };
        var uncertainty = new Option<double?>("--uncertainty")
        {
            Description =
                "Expanded (k = 2) transfer uncertainty of a measurement: 20ppm, 0.002% (default 20 ppm, or from "
                + "--meter)",
            CustomParser = r => TradeValueParser.Fraction(r),
        };
        var meter = new Option<string?>("--meter")
        {
            Description =
                "Meter profile (name under instruments/ or file) whose transfer uncertainty at --nplc is used",
        };
        var nplc = new Option<double>("--nplc")
        {
            Description = "Integration time for --meter, power-line cycles (default 1)",
            DefaultValueFactory = _ => 1,
        };
        var db = CliOptions.Database();
        var fromSession = new Option<string?>("--from-session")
        {
            Description = "Take the value distribution from this session's measured parts (read-only)",
        };
        var fromLibrary = new Option<bool>("--from-library")
        {
            Description = "Take the value distribution from the library's available parts (read-only)",
        };
        var trials = new Option<int>("--trials")
        {
            Description = "Monte Carlo trials (1 to 100 000, default 1 000)",
            DefaultValueFactory = _ => 1000,
        };
        var seed = new Option<int>("--seed")
        {
            Description = "Seed; the same seed and inputs give the same answer (default 1)",
            DefaultValueFactory = _ => 1,
        };
        var maxParts = new Option<int>("--max-parts")
        {
            Description = "Most parts one trial may buy (default 20 000)",
            DefaultValueFactory = _ => 20_000,
        };
        var prices = new Option<string?>("--prices")
        {
            Description = "YAML of unit prices per quantity break: '10k: { 1: 0.10, 100: 0.05 }', 'default: {...}'",
        };
        var price = new Option<string?>("--price")
        {
            Description = "Quantity breaks for every nominal without its own: 1:0.10,100:0.05",
        };
        var csv = new Option<string?>("--csv")
        {
            Description = "Write the order (per confidence and nominal) to this CSV file",
        };
        var curveCsv = new Option<string?>("--curve-csv")
        {
            Description = "Write sets made against parts bought to this CSV file",
        };
        var plot = new Option<string?>("--plot")
        {
            Description = "Write a PNG of sets made against parts bought with its 5-95 % band",
        };
        var perNominal = new Option<bool>("--per-nominal")
        {
            Description =
                "Trim each nominal's quantity in turn to the least that still makes the sets at each confidence "
                + "(slower; default: every nominal in per-set proportion)",
        };
        var timeLimit = new Option<double?>("--time-limit")
        {
            Description =
                "Seconds of set search per assembler run in a trial (0.01 to 1); default none: the fast sweep, "
                + "repeatable by seed",
        };
        foreach (
            var o in new Option[]
            {
                recipe,
                sets,
                stock,
                tolerance,
                gap,
                uncertainty,
                meter,
                nplc,
                db,
                fromSession,
                fromLibrary,
                trials,
                seed,
                maxParts,
                prices,
                price,
                csv,
                curveCsv,
                plot,
                perNominal,
                timeLimit,
            }
        )
        {
            command.Add(o);
        }

        command.SetAction(
            (r, ct) =>
                VerbGuard.RunAsync(console ?? AnsiConsole.Console, () =>
                    OrderRunner.RunAsync(
                        new OrderRequest(
                            r.GetValue(recipe)!,
                            r.GetValue(sets),
                            r.GetValue(stock)!,
                            r.GetValue(tolerance),
                            r.GetValue(gap),
                            r.GetValue(uncertainty),
                            r.GetValue(meter),
                            r.GetValue(nplc),
                            r.GetValue(db)!,
                            r.GetValue(fromSession),
                            r.GetValue(fromLibrary),
                            Range(r.GetValue(trials), "--trials", 1, 100_000),
                            r.GetValue(seed),
                            Range(r.GetValue(maxParts), "--max-parts", 1, 1_000_000),
                            r.GetValue(prices),
                            r.GetValue(price),
                            r.GetValue(csv),
                            r.GetValue(curveCsv),
                            r.GetValue(plot),
                            TimeLimit(r.GetValue(timeLimit), 1),
                            r.GetValue(perNominal)
                        ),
                        console ?? AnsiConsole.Console,
                        ct
                    )
                )
        );
        return command;
    }

    internal static int Range(int value, string option, int min, int max) =>
        value >= min && value <= max
            ? value
            : throw new VerbException(FormattableString.Invariant($"{option}: {value} is outside {min} to {max}"));

    /// <summary>--time-limit in seconds, 0.01 to <paramref name="max"/> (the order verb runs the assembler about twenty
    /// times per trial, so it caps the limit at 1 s to keep 1 000 trials from running for hours).</summary>
    internal static TimeSpan? TimeLimit(double? seconds, double max) =>
        seconds switch
        {
            null => null,
            >= 0.01 when seconds <= max => TimeSpan.FromSeconds(seconds.Value),
            _ => throw new VerbException(
                FormattableString.Invariant($"--time-limit: {seconds} s is outside 0.01 to {max} s")
            ),
        };
}
