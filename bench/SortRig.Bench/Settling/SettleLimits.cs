using SortRig.Instruments.Profiles;
using SortRig.Simulator;
using SortRig.Simulator.Meter;
using SortRig.Simulator.Physics;

namespace SortRig.Bench.Settling;

/// <summary>
/// `settle-limits [parts]`: the two oracles alone (the averaging information limit and the fit information limit,
/// without and with the body's prior), per benchmark case on the benchmark's seeds, in seconds: a quick look at the
/// ceilings. Neither oracle depends on the reading noise, so the figures are those the full benchmark prints.
/// </summary>
internal static class SettleLimits
{
    public static int Run(string[] args)
    {
        var parts = args.Length > 1 && int.TryParse(args[1], out var p) ? p : 300;
        var root = RepositoryRoot.Find();
        var profile = MeterProfileLoader.Load(Path.Combine(root, "instruments", "simulator.yaml"));
        var range = profile.FindRange(SettleCase.Range)!;
        var bounce = new SimulatedBenchOptions().ContactBounce;
        var horizon = TimeSpan.FromSeconds(55);
        foreach (var c in SettleCase.All(parts, []))
        {
            var setting = NplcSetting.Find(c.Nplc)!;
            var sigma = Math.Sqrt(
                Math.Pow(setting.NoiseOhms(range.FullScale), 2) + (Math.Pow(setting.Step(range.FullScale), 2) / 12)
            );
            var bodyLogSd = SettleBenchmark.LogUniformSd(c.Reel.ThermalTimeConstantSpread);
            var source = new InsertionSource(c.Reel, c.Physics, c.Seed, range.FullScale, c.Nplc);
            var (floored, eitherFloored) = (new List<double>(), new List<double>());
            var bench = new BenchNoiseColumns();
            var spec = new PhysicsSpec { Model = c.Physics };
            var popcornShare = c.Physics == PhysicsModel.Rich ? spec.PopcornShare : 0;
            var (avg, fit, prior, either) = (
                new List<double>(),
                new List<double>(),
                new List<double>(),
                new List<double>()
            );
            foreach (var ins in source.Insertions())
            {
                var part = source.Part(ins.Index);
                var a = InformationLimit.Run(ins, SettleCase.TargetPpm, sigma, bounce, horizon);
                var f = FitLimit.Run(ins, part, SettleCase.TargetPpm, sigma, bounce, horizon);
                avg.Add(a.Seconds);
                fit.Add(f.Seconds);
                either.Add(FitLimit.Earlier(a, f).Seconds);
                var withPrior = FitLimit.Run(ins, part, SettleCase.TargetPpm, sigma, bounce, horizon, bodyLogSd);
                prior.Add(withPrior.Seconds);
                // The predictive rule's least record: a fit may accept from its MinReadings-th reading after the
                // bounce, the fewest on which its runs test can reject (PredictiveOptions.MinReadings).
                var least = ins.Since(ins.FirstEndingAtOrAfter(bounce) + MinReadings - 1).TotalSeconds;
                floored.Add(Math.Max(withPrior.Seconds, least));
                eitherFloored.Add(Math.Min(a.Seconds, Math.Max(withPrior.Seconds, least)));
                var noise = FitLimit.BenchNoise(c.Physics, sigma, ins.Truth);
                var under = FitLimit.RunUnder(ins, part, SettleCase.TargetPpm, noise, bounce, horizon);
                var underPrior = FitLimit.RunUnder(
                    ins,
                    part,
                    SettleCase.TargetPpm,
                    noise,
                    bounce,
                    horizon,
                    bodyLogSd,
                    MinReadings
                );
                bench.Add(a, under, underPrior, eitherFloored[^1], floored[^1], popcornShare, spec.PopcornDwell);
            }

            Console.WriteLine(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"{c.Name}: averaging limit {avg.Average():0.00} s; fit limit {fit.Average():0.00} s "
                        + $"({fit.Average() / avg.Average():0.00} ×, p95 {Quantile(fit, 0.95):0.00}); with body prior "
                        + $"(ln τ sd {bodyLogSd:0.000}) {prior.Average():0.00} s ("
                        + $"{prior.Average() / avg.Average():0.00} ×); either {either.Average():0.00} s ("
                        + $"{either.Average() / avg.Average():0.00} ×); with body prior from reading {MinReadings} "
                        + $"{floored.Average():0.00} s ({floored.Average() / avg.Average():0.00} ×), or the averaging "
                        + $"limit if earlier {eitherFloored.Average():0.00} s ("
                        + $"{eitherFloored.Average() / avg.Average():0.00} ×)"
                )
            );
            Console.WriteLine(bench.Line(c.Name, avg.Average()));
        }

        return 0;
    }

    private static int MinReadings => SortRig.Measurement.Settling.PredictiveOptions.Default.MinReadings;

    private static double Quantile(List<double> values, double q) =>
        MathNet.Numerics.Statistics.Statistics.Quantile(values, q);
}
