using System.Diagnostics;
using SortRig.Instruments.Profiles;
using SortRig.Measurement.Settling;
using SortRig.Simulator;
using SortRig.Simulator.Meter;

namespace SortRig.Bench.Settling;

/// <summary>
/// `settle` benchmark: the averaging and predictive settle rules vs the accuracy-matched fixed delay and the
/// information limit, on both simulated physics models; writes docs/bench-settle.md.
/// </summary>
internal static class SettleBenchmark
{
    public static async Task<int> RunAsync(string[] args, CancellationToken ct)
    {
        var parts = args.Length > 1 && int.TryParse(args[1], out var p) ? p : 3_000;
        int? simpleParts = args.Length > 2 && int.TryParse(args[2], out var q) ? q : null;
        var root = RepositoryRoot.Find();
        var profile = MeterProfileLoader.Load(Path.Combine(root, "instruments", "simulator.yaml"));
        var range = profile.FindRange(SettleCase.Range)
            ?? throw new InvalidOperationException("simulator profile has no 10 kOhm range");
        var averaging = SettleCase.SortOptions();
        var variants = new (string, SettleOptions)[]
        {
            ("averaging (sort's rule until now: span 4 s)", averaging),
            ("predictive (+ averaging fallback)", averaging with { Predictive = SettleCase.Predictive }),
        };
        var clock = Stopwatch.StartNew();
        var cases = SettleCase.All(parts, variants, simpleParts);
        var results = new (List<string> Section, CaseOverview Overview)[cases.Count];

        // Four cases at a time (independent seeds and benches): the run shares 2 cores with other work.
        Parallel.For(0, cases.Count, new ParallelOptions { MaxDegreeOfParallelism = 4, CancellationToken = ct }, i =>
        {
            var c = cases[i];
            var nplc = profile.FindNplc(c.Nplc)
                ?? throw new InvalidOperationException($"simulator profile has no NPLC {c.Nplc}");
            var setting = NplcSetting.Find(c.Nplc)!;
            var sigma = Math.Sqrt(
                Math.Pow(setting.NoiseOhms(range.FullScale), 2) + (Math.Pow(setting.Step(range.FullScale), 2) / 12)
            );
            var bounce = new SimulatedBenchOptions().ContactBounce;
            var outcomes = c.Variants.Select(_ => new List<RuleOutcome>()).ToList();
            var priors = c.Variants.Select(_ => ReelPrior.Empty).ToArray();
            var fixedDelay = new MatchedFixedDelay(range, nplc);
            var limit = new List<RuleOutcome>();
            var fitLimit = new List<RuleOutcome>();
            var fitLimitPrior = new List<RuleOutcome>();
            var bodyLogSd = LogUniformSd(c.Reel.ThermalTimeConstantSpread);
            var source = new InsertionSource(c.Reel, c.Physics, c.Seed, range.FullScale, c.Nplc);
            foreach (var insertion in source.Insertions())
            {
                ct.ThrowIfCancellationRequested();
                for (var v = 0; v < c.Variants.Count; v++)
                {
                    outcomes[v].Add(AdaptiveRule.Run(insertion, range, nplc, c.Variants[v].Options, ref priors[v]));
                }

                fixedDelay.Add(insertion);
                limit.Add(
                    InformationLimit.Run(insertion, SettleCase.TargetPpm, sigma, bounce, TimeSpan.FromSeconds(55))
                );
                var part = source.Part(insertion.Index);
                var horizon = TimeSpan.FromSeconds(55);
                fitLimit.Add(FitLimit.Run(insertion, part, SettleCase.TargetPpm, sigma, bounce, horizon));
                fitLimitPrior.Add(
                    FitLimit.Run(insertion, part, SettleCase.TargetPpm, sigma, bounce, horizon, bodyLogSd)
                );
            }

            var summaries = c
                .Variants.Select((v, i) => RuleSummary.Of(v.Name, outcomes[i], SettleCase.TargetPpm))
                .ToList();
            var (delay, matched) = fixedDelay.Match(SettleCase.TargetPpm);
            var delayName = delay is { } d
                ? FormattableString.Invariant($"fixed delay, accuracy-matched: {d.TotalSeconds:0.0} s + 10 readings")
                : "fixed delay: no delay up to 40 s keeps ≤ 0.1 % outside 2 × target (40 s shown)";
            var fixedSummary = RuleSummary.Of(delayName, matched, SettleCase.TargetPpm);
            var limitSummary = RuleSummary.Of("information limit (oracle)", limit, SettleCase.TargetPpm);
            var fitSummary = RuleSummary.Of("fit information limit (oracle, CRB)", fitLimit, SettleCase.TargetPpm);
            var fitPriorSummary = RuleSummary.Of(
                "fit information limit, body τ known to the reel's spread (Bayesian, approximate)",
                fitLimitPrior,
                SettleCase.TargetPpm
            );
            var either = limit.Zip(fitLimit, FitLimit.Earlier).ToList();
            var eitherSummary = RuleSummary.Of(
                "either limit (per part the earlier of the two oracles)",
                either,
                SettleCase.TargetPpm
            );
            var section = ResultsTable.Section(
                c,
                nplc,
                summaries,
                fixedSummary,
                limitSummary,
                [fitSummary, fitPriorSummary, eitherSummary]
            );
            var caseOverview = new CaseOverview(
                c.Name,
                summaries[0],
                summaries[1],
                fixedSummary,
                delay is not null,
                limitSummary,
                fitSummary,
                fitPriorSummary,
                eitherSummary
            );
            results[i] = (section, caseOverview);
            var elapsed = FormattableString.Invariant($"\n({clock.Elapsed.TotalSeconds:0} s so far)");
            Console.WriteLine(string.Join('\n', section) + elapsed);
        });

        var all = ResultsTable.Overview([.. results.Select(r => r.Overview)]);
        all.AddRange(results.SelectMany(r => r.Section));
        var counts =
            simpleParts is { } sp && sp != parts
                ? FormattableString.Invariant($"{parts} insertions per rich case, {sp} per simple case")
                : FormattableString.Invariant($"{parts} insertions per case");
        var wall = clock.Elapsed.TotalSeconds;
        all.Add(
            FormattableString.Invariant($"Run: {counts}, four cases at a time, {wall:0} s wall ")
                + FormattableString.Invariant($"on {Environment.ProcessorCount} cores, .NET {Environment.Version}.")
        );
        await ResultsTable.WriteAsync(Path.Combine(root, "docs", "bench-settle.md"), all, ct).ConfigureAwait(false);
        return 0;
    }

    /// <summary>Standard deviation of ln(u) for u ~ U(1 − spread, 1 + spread): the reel's spread of ln τ_body
    /// (τ = τ₀ u). E[ln u] and E[ln² u] from the antiderivatives u ln u − u and u (ln² u − 2 ln u + 2).</summary>
    internal static double LogUniformSd(double spread)
    {
        if (spread <= 0)
        {
            return 1e-9;
        }

        var (a, b) = (1 - spread, 1 + spread);
        double M1(double u) => (u * Math.Log(u)) - u;
        double M2(double u) => u * ((Math.Log(u) * Math.Log(u)) - (2 * Math.Log(u)) + 2);
        var mean = (M1(b) - M1(a)) / (b - a);
        var square = (M2(b) - M2(a)) / (b - a);
        return Math.Sqrt(Math.Max(0, square - (mean * mean)));
    }
}

/// <summary>One case's figures for the overview table.</summary>
internal sealed record CaseOverview(
    string Name,
    RuleSummary Averaging,
    RuleSummary Predictive,
    RuleSummary Fixed,
    bool FixedMatched,
    RuleSummary Limit,
    RuleSummary FitLimit,
    RuleSummary FitLimitPrior,
    RuleSummary Either
);

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

        return dir?.FullName
            ?? throw new InvalidOperationException(
                "Run from inside the repository (no SortRig.sln found above the working directory)."
            );
    }
}
