using SortRig.Engine.Sorting;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;

namespace SortRig.Tests.Support;

/// <summary>
/// Compares stored parts with the simulator's truth (its side channel, the outside reference):
/// each part must sit in the cup its true value calls for, unless a band edge lies between the
/// true and the measured value within the part's stated expanded uncertainty (k = 2, JCGM 100:2008
/// sec. 6), and the measured value must lie within that uncertainty of the true value.
/// </summary>
internal static class TruthCheck
{
    /// <summary>Problems found (empty when every part is where its truth puts it) and the number excused on a band
    /// edge.</summary>
    public static (List<string> Problems, int OnEdge) Compare(
        SortOptions o,
        IReadOnlyList<PartRecord> parts,
        Func<int, double> truthOfNumber
    )
    {
        var problems = new List<string>();
        var onEdge = 0;
        foreach (var part in parts)
        {
            var t = truthOfNumber(part.Number);

            // The stated uncertainty covers the meter's accuracy; allow it plus the 1 ppm resolution of the reading
            // (common practice, no source) before calling the value wrong.
            var allowed = part.Measured.Expanded + (1e-6 * o.Nominal);
            if (Math.Abs(part.Value - t) > allowed)
            {
                problems.Add($"part {part.Number}: measured {part.Value:F3} but true {t:F3} (allowed ± {allowed:F3})");
            }

            var expected = CupFor(o, part.Number, t);
            if (expected == part.CupLabel)
            {
                continue;
            }

            var edge = EdgeBetween(o, part.Number, t, part.Value);
            if (Math.Abs(t - edge) <= part.Measured.Expanded)
            {
                onEdge++;
                continue;
            }

            problems.Add(
                $"part {part.Number}: true {t:F3} -> cup {expected}, measured {part.Value:F3} ± "
                    + $"{part.Measured.Expanded:F3} -> cup {part.CupLabel}"
            );
        }

        return (problems, onEdge);
    }

    private static string CupFor(SortOptions o, long number, double ohms) =>
        new BandCupAssigner(new BandCupOptions(o.Cups, o.MatchTolerance * 1e6, o.Nominal, o.StockTolerance * 100))
            .Assign(new CupRequest(number, o.Nominal, new MeasuredValue(ohms, 0, 0)))
            .CupLabel;

    private static double EdgeBetween(SortOptions o, long number, double a, double b)
    {
        var cupA = CupFor(o, number, a);
        for (var i = 0; i < 60; i++)
        {
            var mid = (a + b) / 2;
            if (CupFor(o, number, mid) == cupA)
            {
                a = mid;
            }
            else
            {
                b = mid;
            }
        }

        return (a + b) / 2;
    }
}
