using SortRig.Measurement.Specs;

namespace SortRig.Bench.Settling;

/// <summary>Markdown for the results, and the write into docs/bench-settle.md between its result markers.</summary>
internal static class ResultsTable
{
    public const string Begin = "<!-- settle-results:begin (written by the benchmark) -->";
    public const string End = "<!-- settle-results:end -->";

    /// <summary>The per-case overview against the issue's targets.</summary>
    public static List<string> Overview(IReadOnlyList<CaseOverview> cases)
    {
        var lines = new List<string>
        {
            "### Overview (targets: predictive ≤ 0.6 × limit; false accepts vs 2 × target ≤ 0.1 % at the 95 % upper "
                + "bound; ≥ 2 × faster than the matched fixed delay)",
            "",
            "| case | limit s | averaging s (× limit) | predictive s (× limit) | predictive parts/h | by prediction "
                + "| predictive false accepts vs 2 × target: n / accepted, 95 % upper | matched fixed delay s | fixed "
                + "/ predictive | fit limit s (× limit) | fit limit, body τ prior s (× limit) | either limit s (× "
                + "limit) "
                + "| predictive × fit limit | predictive × either limit | targets |",
            "|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|",
        };
        foreach (var c in cases)
        {
            var p = c.Predictive;
            var ratio = p.Seconds.Mean / c.Limit.Seconds.Mean;
            var speedup = c.Fixed.Seconds.Mean / p.Seconds.Mean;
            var met = ratio <= 0.6 && p.UpperTarget <= 0.001 && speedup >= 2 && c.FixedMatched;
            var fixedText = c.FixedMatched ? FormattableString.Invariant($"{c.Fixed.Seconds.Mean:0.00}") : "> 40";
            lines.Add(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"| {c.Name} | {c.Limit.Seconds.Mean:0.00} | {c.Averaging.Seconds.Mean:0.00} ("
                        + $"{c.Averaging.Seconds.Mean / c.Limit.Seconds.Mean:0.00}) | {p.Seconds.Mean:0.00} ("
                        + $"{ratio:0.00}) | {p.PartsPerHour:0} | "
                        + $"{100.0 * p.Predicted / Math.Max(1, p.Accepted):0.0} % | {p.FalseAcceptsTarget} / "
                        + $"{p.Accepted}, {100 * p.UpperTarget:0.###} % | {fixedText} | "
                        + $"{(c.FixedMatched ? "" : "> ")}{speedup:0.0} | {c.FitLimit.Seconds.Mean:0.00} ("
                        + $"{c.FitLimit.Seconds.Mean / c.Limit.Seconds.Mean:0.00}) | "
                        + $"{c.FitLimitPrior.Seconds.Mean:0.00} ("
                        + $"{c.FitLimitPrior.Seconds.Mean / c.Limit.Seconds.Mean:0.00}) | "
                        + $"{c.Either.Seconds.Mean:0.00} ({c.Either.Seconds.Mean / c.Limit.Seconds.Mean:0.00}) | "
                        + $"{p.Seconds.Mean / c.FitLimit.Seconds.Mean:0.00} | "
                        + $"{p.Seconds.Mean / c.Either.Seconds.Mean:0.00} | {Verdict(met)} |"
                )
            );
        }

        lines.Add("");
        return lines;
    }

    public static List<string> Section(
        SettleCase c,
        NplcSpec nplc,
        IReadOnlyList<RuleSummary> adaptive,
        RuleSummary fixedDelay,
        RuleSummary limit,
        IReadOnlyList<RuleSummary> fitLimits
    )
    {
        var lines = new List<string>
        {
            string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"### {c.Name} ({c.Reel.Count} insertions, seed {c.Seed}, {nplc.ReadingsPerSecond:G3} readings/s in "
                    + $"the profile)"
            ),
            "",
            "| rule | accepted / unstable | s mean | s median | s p95 | parts/h | × limit | readings mean | false "
                + "accepts vs U (k=2): n, rate, 95 % upper | vs 2 × target: n, rate, 95 % upper | abs. error ppm: "
                + "median / p99 / max | median U ppm |",
            "|---|---|---|---|---|---|---|---|---|---|---|---|",
        };
        lines.AddRange(adaptive.Append(fixedDelay).Append(limit).Concat(fitLimits).Select(s => Row(s, limit)));
        lines.Add("");
        return lines;
    }

    public static Task WriteAsync(string path, IReadOnlyList<string> results, CancellationToken ct) =>
        ReplaceBlockAsync(path, Begin, End, results, ct);

    /// <summary>Replaces the text between the markers <paramref name="begin"/> and <paramref name="end"/> of the page
    /// at <paramref name="path"/> with <paramref name="lines"/> (a missing page is created with both
    /// markers).</summary>
    public static async Task ReplaceBlockAsync(
        string path,
        string begin,
        string end,
        IReadOnlyList<string> lines,
        CancellationToken ct
    )
    {
        var text = File.Exists(path)
            ? await File.ReadAllTextAsync(path, ct).ConfigureAwait(false)
            : $"# Settle rule benchmark\n\n{begin}\n{end}\n";
        var from = text.IndexOf(begin, StringComparison.Ordinal);
        var to = text.IndexOf(end, StringComparison.Ordinal);
        if (from < 0 || to < from)
        {
            throw new InvalidDataException(
                $"{path}: the markers '{begin}' and '{end}' (in that order) are needed to place the results."
            );
        }

        var body = string.Join('\n', lines).TrimEnd();
        var updated = text[..(from + begin.Length)] + "\n\n" + body + "\n\n" + text[to..];
        await File.WriteAllTextAsync(path, updated, ct).ConfigureAwait(false);
    }

    private static string Row(RuleSummary s, RuleSummary limit)
    {
        string Fa(int n, double rate, double upper) =>
            s.Measures ? FormattableString.Invariant($"{n}, {100 * rate:0.###} %, {100 * upper:0.###} %") : "—";
        var errors = s.Measures
            ? FormattableString.Invariant(
                $"{s.MedianAbsErrorPpm:0.0} / {s.P99AbsErrorPpm:0.0} / {s.MaxAbsErrorPpm:0.0}"
            )
            : "—";
        var u = s.Measures ? FormattableString.Invariant($"{s.MedianUPpm:0.0}") : "—";
        return string.Create(
            System.Globalization.CultureInfo.InvariantCulture,
            $"| {s.Rule} | {s.Accepted} / {s.Unstable} | {s.Seconds.Mean:0.00} | {s.Seconds.Median:0.00} | "
                + $"{s.Seconds.P95:0.00} | {s.PartsPerHour:0} | {s.Seconds.Mean / limit.Seconds.Mean:0.00} | "
                + $"{s.Readings.Mean:0.0} | {Fa(s.FalseAcceptsU, s.RateU, s.UpperU)} | "
                + $"{Fa(s.FalseAcceptsTarget, s.RateTarget, s.UpperTarget)} | {errors} | {u} |"
        );
    }

    private static string Verdict(bool met) => met ? "**met**" : "**not met**";
}
