using System.Globalization;

namespace SortRig.Reporting.Reports;

/// <summary>
/// The pace line of summary.md: mean seconds between consecutive acceptances from the first accepted part to the last
/// (the wait for the first part is left out), parts per hour, and how many parts each settle rule accepted.
/// </summary>
internal static class ReportPace
{
    /// <summary>The line, or null when fewer than two parts carry an acceptance time or they span no time.</summary>
    public static string? Line(IReadOnlyList<ReportPart> parts)
    {
        var times = parts.Where(p => p.AcceptedAt is not null).Select(p => p.AcceptedAt!.Value).ToList();
        if (times.Count < 2)
        {
            return null;
        }

        double perPart = (times.Max() - times.Min()).TotalSeconds / (times.Count - 1);
        if (perPart <= 0)
        {
            return null;
        }

        var byRule = string.Join(
            ", ",
            parts
                .Where(p => p.AcceptedBy is not null)
                .GroupBy(p => p.AcceptedBy!, StringComparer.Ordinal)
                .OrderBy(g => g.Key, StringComparer.Ordinal)
                .Select(g => $"{g.Key.ToLowerInvariant()} {g.Count()}")
        );
        return string.Create(
            CultureInfo.InvariantCulture,
            $"Pace: {perPart:0.0} s per part, {3600 / perPart:0} parts per hour (first accepted part to last, "
                + $"{times.Count} parts){(byRule.Length > 0 ? $"; settled by {byRule}" : "")}."
        );
    }
}
