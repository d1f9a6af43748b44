namespace SortRig.Planning.Cups;

/// <summary>
/// Band (cup) edges of a fixed-band sort, for the report histogram. The log stores each part's cup and the
/// batch's match tolerance, not the number of cups; with K cups of width w centred on the nominal, cup i covers
/// [-K w/2 + i w, -K w/2 + (i+1) w) ppm (<see cref="BandCupAssigner"/>), so K is the count that puts every
/// sorted part in its recorded cup.
/// </summary>
public static class CupEdgeInference
{
    /// <summary>The K + 1 band edges in ppm of nominal for <paramref name="cupCount"/> cups of <paramref
    /// name="matchPpm"/>.</summary>
    public static IReadOnlyList<double> Edges(int cupCount, double matchPpm)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(cupCount, 1);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(matchPpm);
        return [.. Enumerable.Range(0, cupCount + 1).Select(i => (-cupCount * matchPpm / 2) + (i * matchPpm))];
    }

    /// <summary>
    /// The smallest cup count (1..23) consistent with every part's recorded regular cup, or null when there is no
    /// sorted part or no count fits (e.g. the session used adaptive bands).
    /// </summary>
    /// <param name="parts">Deviation from nominal in ppm and the cup label of each part; reject and slot labels are
    /// ignored.</param>
    /// <param name="matchPpm">Band width, ppm.</param>
    public static int? InferCupCount(IEnumerable<(double DeviationPpm, string? Cup)> parts, double matchPpm)
    {
        ArgumentNullException.ThrowIfNull(parts);
        var sorted = parts
            .Select(p => (p.DeviationPpm, Index: p.Cup is null ? -1 : CupLabels.IndexOf(p.Cup)))
            .Where(p => p.Index >= 0)
            .ToList();
        if (sorted.Count == 0 || matchPpm <= 0)
        {
            return null;
        }

        for (var k = sorted.Max(p => p.Index) + 1; k <= CupLabels.MaxCups; k++)
        {
            var low = -k * matchPpm / 2;
            if (sorted.All(p => Fits(p.DeviationPpm, p.Index, low, matchPpm)))
            {
                return k;
            }
        }

        return null;
    }

    // The stored deviation is recomputed from the stored value, so allow a part a hair (1e-6 ppm) on either side of an
    // edge.
    private static bool Fits(double dev, int index, double low, double width) =>
        Math.Floor((dev - low) / width) == index
        || Math.Floor((dev + 1e-6 - low) / width) == index
        || Math.Floor((dev - 1e-6 - low) / width) == index;
}
