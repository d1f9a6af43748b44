using System.Diagnostics;
using SortRig.Instruments.Profiles;
using SortRig.Measurement.Settling;
using SortRig.Simulator;
using SortRig.Simulator.Meter;

namespace SortRig.Bench.Settling;

/// <summary>`settle` benchmark: adaptive settle rule vs a fixed delay and the information limit; writes docs/bench-settle.md.</summary>
internal static class SettleBenchmark
{
    public static async Task<int> RunAsync(string[] args, CancellationToken ct)
    {
        var parts = args.Length > 1 && int.TryParse(args[1], out var p) ? p : 10_000;
        var root = RepositoryRoot.Find();
        var profile = MeterProfileLoader.Load(Path.Combine(root, "instruments", "simulator.yaml"));
        var range = profile.FindRange(SettleCase.Range) ?? throw new InvalidOperationException("simulator profile has no 10 kOhm range");
        var span = SettleCase.SortOptions() with { SettlingSpan = TimeSpan.FromSeconds(4) };
        var variants = new (string, SettleOptions)[]
        {
            ("adaptive, before: window slope test, no residual term", SettleCase.SortOptions() with { AssumedTimeConstant = TimeSpan.Zero }),
            ("adaptive, sort options now: + residual term (τa 5 s)", SettleCase.SortOptions()),
            ("adaptive + settling span 4 s", span),
            ("adaptive + settling span 4 s, window 4", span with { WindowLength = 4 }),
        };
        var sections = new List<string>();
        var clock = Stopwatch.StartNew();
        foreach (var c in SettleCase.All(parts, variants))
        {
            var nplc = profile.FindNplc(c.Nplc) ?? throw new InvalidOperationException($"simulator profile has no NPLC {c.Nplc}");
            var setting = NplcSetting.Find(c.Nplc)!;
            var sigma = Math.Sqrt(Math.Pow(setting.NoiseOhms(range.FullScale), 2) + (Math.Pow(setting.Step(range.FullScale), 2) / 12));
            var bounce = new SimulatedBenchOptions().ContactBounce;
            var outcomes = c.Variants.Select(_ => new List<RuleOutcome>()).ToList();
            var fixedDelay = new List<RuleOutcome>();
            var limit = new List<RuleOutcome>();
            foreach (var insertion in new InsertionSource(c.Reel, c.Seed, range.FullScale, c.Nplc).Insertions())
            {
                ct.ThrowIfCancellationRequested();
                for (var v = 0; v < c.Variants.Count; v++)
                {
                    outcomes[v].Add(AdaptiveRule.Run(insertion, range, nplc, c.Variants[v].Options));
                }

                fixedDelay.Add(FixedDelayRule.Run(insertion, range, nplc, fourWire: true));
                limit.Add(InformationLimit.Run(insertion, SettleCase.TargetPpm, sigma, bounce, TimeSpan.FromSeconds(55)));
            }

            var summaries = c.Variants.Select((v, i) => RuleSummary.Of(v.Name, outcomes[i], SettleCase.TargetPpm)).ToList();
            var fixedSummary = RuleSummary.Of("fixed delay (3 s + 10 readings)", fixedDelay, SettleCase.TargetPpm);
            var limitSummary = RuleSummary.Of("information limit", limit, SettleCase.TargetPpm);
            var section = ResultsTable.Section(c, nplc, summaries, fixedSummary, limitSummary);
            Console.WriteLine(string.Join('\n', section));
            Console.WriteLine(FormattableString.Invariant($"({clock.Elapsed.TotalSeconds:0} s so far)"));
            sections.AddRange(section);
        }

        sections.Add(FormattableString.Invariant(
            $"Run: {parts} insertions per case, {clock.Elapsed.TotalSeconds:0} s wall on {Environment.ProcessorCount} cores, .NET {Environment.Version}."));
        await ResultsTable.WriteAsync(Path.Combine(root, "docs", "bench-settle.md"), sections, ct).ConfigureAwait(false);
        return 0;
    }
}

/// <summary>Finds the repository root (the folder holding SortRig.sln) from the working directory up.</summary>
internal static class RepositoryRoot
{
    public static string Find()
    {
        var dir = new DirectoryInfo(Directory.GetCurrentDirectory());
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SortRig.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("Run from inside the repository (no SortRig.sln found above the working directory).");
    }
}
