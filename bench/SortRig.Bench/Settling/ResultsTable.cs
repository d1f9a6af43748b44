using SortRig.Measurement.Specs;

namespace SortRig.Bench.Settling;

/// <summary>Markdown for the results, and the write into docs/bench-settle.md between its result markers.</summary>
internal static class ResultsTable
{
    public const string Begin = "<!-- settle-results:begin (written by the benchmark) -->";
    public const string End = "<!-- settle-results:end -->";

    public static List<string> Section(SettleCase c, NplcSpec nplc, IReadOnlyList<RuleSummary> adaptive, RuleSummary fixedDelay, RuleSummary limit)
    {
        var lines = new List<string>
        {
            FormattableString.Invariant($"### {c.Name} ({c.Reel.Count} insertions, seed {c.Seed}, {nplc.ReadingsPerSecond:G3} readings/s in the profile)"),
            "",
            "| rule | accepted / unstable | s mean | s median | s p95 | readings mean | median | p95 | false accepts vs U (k=2): n, rate, 95 % upper | vs 2 × target: n, rate, 95 % upper | abs. error ppm: median / p99 / max | median U ppm |",
            "|---|---|---|---|---|---|---|---|---|---|---|---|",
        };
        lines.AddRange(adaptive.Append(fixedDelay).Append(limit).Select(Row));
        lines.Add("");
        foreach (var a in adaptive)
        {
            var toLimit = a.Seconds.Mean / limit.Seconds.Mean;
            var readingsToLimit = a.Readings.Mean / limit.Readings.Mean;
            var speedup = fixedDelay.Seconds.Mean / a.Seconds.Mean;
            var accurate = Math.Max(a.RateU, a.RateTarget) <= 0.001;
            lines.Add(
                FormattableString.Invariant($"- {a.Rule}: adaptive / limit = {toLimit:0.00} in mean seconds ({readingsToLimit:0.00} in readings) — target ≤ 1.25 {Verdict(toLimit <= 1.25 && accurate)}") +
                (toLimit <= 1.25 && !accurate ? " (fast only by accepting values outside the target)" : "") +
                FormattableString.Invariant($"; fixed / adaptive = {speedup:0.00} — target ≥ 2 {Verdict(speedup >= 2)}; ") +
                FormattableString.Invariant($"false accepts {100 * a.RateU:0.###} % vs U, {100 * a.RateTarget:0.###} % vs 2 × target — target ≤ 0.1 % {Verdict(accurate)}."));
        }

        lines.Add("");
        return lines;
    }

    public static async Task WriteAsync(string path, IReadOnlyList<string> results, CancellationToken ct)
    {
        var text = File.Exists(path) ? await File.ReadAllTextAsync(path, ct).ConfigureAwait(false) : $"# Settle rule benchmark\n\n{Begin}\n{End}\n";
        var begin = text.IndexOf(Begin, StringComparison.Ordinal);
        var end = text.IndexOf(End, StringComparison.Ordinal);
        if (begin < 0 || end < begin)
        {
            throw new InvalidDataException($"{path}: the markers '{Begin}' and '{End}' (in that order) are needed to place the results.");
        }

        var body = string.Join('\n', results).TrimEnd();
        var updated = text[..(begin + Begin.Length)] + "\n\n" + body + "\n\n" + text[end..];
        await File.WriteAllTextAsync(path, updated, ct).ConfigureAwait(false);
    }

    private static string Row(RuleSummary s)
    {
        string Fa(int n, double rate, double upper) => s.Measures ? FormattableString.Invariant($"{n}, {100 * rate:0.###} %, {100 * upper:0.###} %") : "—";
        var errors = s.Measures ? FormattableString.Invariant($"{s.MedianAbsErrorPpm:0.0} / {s.P99AbsErrorPpm:0.0} / {s.MaxAbsErrorPpm:0.0}") : "—";
        var u = s.Measures ? FormattableString.Invariant($"{s.MedianUPpm:0.0}") : "—";
        return FormattableString.Invariant(
            $"| {s.Rule} | {s.Accepted} / {s.Unstable} | {s.Seconds.Mean:0.00} | {s.Seconds.Median:0.00} | {s.Seconds.P95:0.00} | {s.Readings.Mean:0.0} | {s.Readings.Median:0} | {s.Readings.P95:0} | {Fa(s.FalseAcceptsU, s.RateU, s.UpperU)} | {Fa(s.FalseAcceptsTarget, s.RateTarget, s.UpperTarget)} | {errors} | {u} |");
    }

    private static string Verdict(bool met) => met ? "**met**" : "**not met**";
}
