using System.Globalization;
using System.Text;
using SortRig.Measurement.Drift;
using SortRig.Measurement.Readings;
using SortRig.Reporting.Plots;

namespace SortRig.Reporting.Reports;

/// <summary>Builds summary.md from computed figures (pure).</summary>
internal static class SummaryMarkdown
{
    public static string Build(
        string title,
        DateTimeOffset generated,
        int partCount,
        ReportManifest figures,
        IReadOnlyList<int> adevFactors,
        string? paceLine = null
    )
    {
        var md = new StringBuilder();
        Line(md, "# " + MarkdownText.Escape(title));
        Line(md, string.Empty);
        Row(
            md,
            string.Create(
                CultureInfo.InvariantCulture,
                $"Generated {generated.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC. {partCount} parts over "
                    + $"{figures.Nominals.Count} nominal values; {figures.Channels.Count} drift channels."
            )
        );
        if (paceLine is not null)
        {
            Line(md, string.Empty);
            Line(md, paceLine);
        }

        Line(md, string.Empty);
        Line(md, "## Parts per nominal (deviation from nominal, ppm)");
        Line(md, string.Empty);
        Line(
            md,
            "| Nominal | Parts | Mean (ppm) | Std dev (ppm) | Min (ppm) | Max (ppm) | Stock tolerance | Histogram |"
        );
        Line(md, "|---|---:|---:|---:|---:|---:|---:|---|");
        foreach (NominalSummary n in figures.Nominals)
        {
            string tol = n.TolerancePercent is { } t ? $"±{t:G3} %" : "n/a";
            Row(
                md,
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"| {OhmsText.Compact(n.NominalOhms)} | {n.Count} | {n.MeanPpm:F1} | {Num(n.StdDevPpm, "F1")} | "
                        + $"{n.MinPpm:F1} | {n.MaxPpm:F1} | {tol} | [{n.HistogramFile}]({n.HistogramFile}) |"
                )
            );
        }

        Line(md, string.Empty);
        Line(md, "## Parts per cup");
        Line(md, string.Empty);
        Line(md, "| Cup | Parts |");
        Line(md, "|---|---:|");
        foreach (KeyValuePair<string, int> cup in figures.CupCounts)
        {
            Row(md, string.Create(CultureInfo.InvariantCulture, $"| {MarkdownText.Escape(cup.Key)} | {cup.Value} |"));
        }

        Line(md, string.Empty);
        if (figures.Channels.Count == 0)
        {
            Line(md, "No drift run in this report (drift and Allan deviation come from `sortrig drift`).");
            Line(md, string.Empty);
        }
        else
        {
            Line(md, "## Drift (ppm of channel mean; ± is one standard error)");
            Line(md, string.Empty);
            Line(
                md,
                "| Channel | Samples | Span (h) | Drift (ppm/h) | Drift, temperature-corrected (ppm/h) | Tempco "
                    + "(ppm/K) | Plots |"
            );
            Line(md, "|---|---:|---:|---:|---:|---:|---|");
            foreach (ChannelSummary c in figures.Channels)
            {
                string drift = c.Drift is { } d ? Pm(d.PpmPerHour) : "n/a (fewer than 3 samples)";
                string jd = c.Joint is { } j ? Pm(j.PpmPerHour) : "n/a";
                string tc = c.Joint is { } k ? Pm(k.PpmPerKelvin) : $"n/a ({c.JointNote})";
                string plots = c.AdevPlotFile is null
                    ? $"[drift]({c.DriftPlotFile})"
                    : $"[drift]({c.DriftPlotFile}), [ADEV]({c.AdevPlotFile})";
                Row(
                    md,
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"| {MarkdownText.Escape(c.Channel)} | {c.Count} | {c.SpanHours:F2} | {drift} | {jd} | {tc} "
                            + $"| {plots} |"
                    )
                );
            }

            Line(md, string.Empty);
            Line(md, "## Overlapping Allan deviation (NIST SP 1065), ppm");
            Line(md, string.Empty);
            Line(md, "| Channel | τ (s) | σ(τ) (ppm) | 68 % interval (ppm) | Terms |");
            Line(md, "|---|---:|---:|---:|---:|");
            foreach (ChannelSummary c in figures.Channels)
            {
                foreach (AllanPoint p in c.Adev.Where(p => adevFactors.Contains(p.AveragingFactor)))
                {
                    Row(
                        md,
                        string.Create(
                            CultureInfo.InvariantCulture,
                            $"| {MarkdownText.Escape(c.Channel)} | {p.TauSeconds:G6} | {p.Deviation * 1e6:G3} | "
                                + $"{p.Lower * 1e6:G3} .. {p.Upper * 1e6:G3} | {p.TermCount} |"
                        )
                    );
                }

                if (!c.EvenlySpaced && c.Adev.Count > 0)
                {
                    Row(
                        md,
                        string.Create(
                            CultureInfo.InvariantCulture,
                            $"| {MarkdownText.Escape(c.Channel)} | note: intervals vary more than 25 % around τ0 = "
                                + $"{c.Tau0Seconds:G4} s; ADEV assumes even spacing | | | |"
                        )
                    );
                }
            }

            Line(md, string.Empty);
        }

        Line(md, "## Data files");
        Line(md, string.Empty);
        foreach (string file in figures.Files.Where(f => f.EndsWith(".csv", StringComparison.Ordinal)))
        {
            Row(md, string.Create(CultureInfo.InvariantCulture, $"- [{file}]({file})"));
        }

        return md.ToString();
    }

    private static string Pm(Coefficient c) =>
        string.Create(CultureInfo.InvariantCulture, $"{c.Value:+0.000;-0.000} ± {c.StandardError:0.000}");

    private static string Num(double v, string format) =>
        double.IsFinite(v) ? v.ToString(format, CultureInfo.InvariantCulture) : "n/a";

    private static void Row(StringBuilder md, string text) => md.Append(text).Append('\n');

    private static void Line(StringBuilder md, string text) => md.Append(text).Append('\n');
}
