using SortRig.Instruments.Profiles;
using SortRig.Measurement.Settling;
using SortRig.Simulator.Physics;

namespace SortRig.Bench.Settling;

/// <summary>
/// `settle-diag [parts] [case]`: runs the predictive rule on one benchmark case and prints each accepted value outside
/// 2 × target with its fit and the part's hidden physics (read here only to explain, never by the rule).
/// </summary>
internal static class SettleDiagnosis
{
    public static int Run(string[] args)
    {
        var parts = args.Length > 1 && int.TryParse(args[1], out var p) ? p : 300;
        var which = args.Length > 2 && int.TryParse(args[2], out var w) ? w : 4;
        var root = RepositoryRoot.Find();
        var profile = MeterProfileLoader.Load(Path.Combine(root, "instruments", "simulator.yaml"));
        var range = profile.FindRange(SettleCase.Range)!;
        var options = SettleCase.SortOptions() with { Predictive = PredictiveOptions.Default };
        var c = SettleCase.All(parts, [("p", options)])[which];
        var nplc = profile.FindNplc(c.Nplc)!;
        var source = new InsertionSource(c.Reel, c.Physics, c.Seed, range.FullScale, c.Nplc);
        Console.WriteLine(c.Name);
        if (args.Length > 3 && args[3] == "trace")
        {
            Trace(source, range.FullScale, nplc.ResolutionPpmOfRange * 1e-6 * range.FullScale);
            return 0;
        }

        var (bad, predicted, seconds, n, predictedSeconds) = (0, 0, 0.0, 0, 0.0);
        foreach (var ins in source.Insertions())
        {
            var tracker = new SettleTracker(range, nplc, options);
            for (var k = 0; k < 200_000; k++)
            {
                var verdict = tracker.Add(ins.Reading(k));
                if (verdict.State == SettleState.Unstable)
                {
                    break;
                }

                if (verdict is not { State: SettleState.Accepted, Acceptance: { } a })
                {
                    continue;
                }

                n++;
                seconds += ins.Since(k).TotalSeconds;
                var err = (a.Value.Value - ins.Truth) / ins.Truth * 1e6;
                predicted += a.AcceptedBy == SettleRule.Predictive ? 1 : 0;
                predictedSeconds += a.AcceptedBy == SettleRule.Predictive ? ins.Since(k).TotalSeconds : 0;
                if (Math.Abs(err) > 10)
                {
                    bad++;
                    var part = source.Part(ins.Index);
                    var popcorn = PopcornRange(ins, k);
                    var left = (ins.Clean(k) - ins.Truth) / ins.Truth * 1e6;
                    var f = a.Fit;
                    Console.WriteLine(FormattableString.Invariant(
                        $"#{ins.Index} err {err,6:0.0} ppm at {ins.Since(k).TotalSeconds,5:0.00} s by {a.AcceptedBy}; left {left,6:0.0} ppm; ") + (f is null ? "" : FormattableString.Invariant(
                        $"fit {f.Model} tau [{string.Join(",", f.TimeConstantsSeconds.Select(x => x.ToString("0.00", System.Globalization.CultureInfo.InvariantCulture)))}] w {f.Weight:0.00} uFit {f.FitUncertainty / ins.Truth * 1e6:0.0} uMis {f.MisfitUncertainty / ins.Truth * 1e6:0.0} n {f.Readings} span {f.SpanSeconds:0.0} runsZ {f.RunsZ:0.0}; ")) + FormattableString.Invariant(
                        $"part tau {part.ThermalTimeConstant.TotalSeconds:0.00} lead {part.LeadShare:0.00}@{part.LeadTimeConstant.TotalSeconds:0.00} tc {part.TempcoPpmPerKelvin:0} warm {ins.WarmKelvin:0.0} popcorn {popcorn:0.0}"));
                }

                break;
            }
        }

        Console.WriteLine(FormattableString.Invariant($"{bad} / {n} outside 2 x target; {predicted} by prediction (mean {predictedSeconds / predicted:0.00} s, fallback {(seconds - predictedSeconds) / (n - predicted):0.00} s); mean {seconds / n:0.00} s"));
        return 0;
    }

    private static void Trace(InsertionSource source, double rangeOhms, double resolution)
    {
        foreach (var ins in source.Insertions().Take(6))
        {
            var part = source.Part(ins.Index);
            Console.WriteLine(FormattableString.Invariant(
                $"part #{ins.Index} tau {part.ThermalTimeConstant.TotalSeconds:0.00} lead {part.LeadShare:0.00}@{part.LeadTimeConstant.TotalSeconds:0.00} tc {part.TempcoPpmPerKelvin:0} warm {ins.WarmKelvin:0.0}"));
            var settling = new PredictiveSettling(PredictiveOptions.Default, resolution, TimeSpan.FromSeconds(5));
            var next = 0.5;
            for (var k = 0; ins.Since(k).TotalSeconds < 12; k++)
            {
                var r = ins.Reading(k);
                if (r.Value > 1e30)
                {
                    settling.Clear();
                    continue;
                }

                settling.Add(r);
                if (ins.Since(k).TotalSeconds < next || k < 12)
                {
                    continue;
                }

                next += 0.5;
                if (settling.Fit(out var white) is { } f)
                {
                    var ppm = 1e6 / ins.Truth;
                    Console.WriteLine(FormattableString.Invariant(
                        $"  {ins.Since(k).TotalSeconds,5:0.0} s err {(f.FinalValue - ins.Truth) * ppm,6:0.0} uFit {f.FitUncertainty * ppm,6:0.0} uMis {f.MisfitUncertainty * ppm,4:0.0} {f.Model} w {f.Weight:0.00} white {white} runsZ {f.RunsZ:0.0} left {(ins.Clean(k) - ins.Truth) * ppm:0.0}"));
                }
            }
        }

        _ = rangeOhms;
    }

    /// <summary>Range of the 0.4 s means of (reading − clean value) up to reading k, ppm: a popcorn step shows as ~4.</summary>
    private static double PopcornRange(Insertion ins, int k)
    {
        var per = Math.Max(1, (int)(0.4 / ins.Period.TotalSeconds));
        var means = new List<double>();
        for (var s = 0; s + per <= k + 1; s += per)
        {
            var sum = 0.0;
            var cnt = 0;
            for (var j = s; j < s + per; j++)
            {
                var r = ins.Reading(j);
                if (double.IsFinite(r.Value) && r.Value < 1e30)
                {
                    sum += (r.Value - ins.Clean(j)) / ins.Truth * 1e6;
                    cnt++;
                }
            }

            if (cnt > 0)
            {
                means.Add(sum / cnt);
            }
        }

        return means.Count == 0 ? 0 : means.Max() - means.Min();
    }
}
