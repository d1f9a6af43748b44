using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// A proven upper bound from the parts each set consumes, a linear programme over how positions are filled.
/// Variables: N (sets), s[k,t] (fills of position k by one part of type t) and h[k,t] (parts of type t used in pairs
/// at k); a part's type is which positions it can fill as a single (after the filters of
/// <see cref="PartCountBound"/>) and in a pair. Constraints: every position filled N times,
/// N ≤ Σ_t s[k,t] + ½ Σ_t h[k,t]; no type used beyond its count, Σ_k (s[k,t] + h[k,t]) ≤ count[t]. Any plan of
/// M sets gives a feasible point with N = M (count its fills), so ⌊LP optimum⌋ ≥ the optimum. Unlike the Hall
/// count it sees that a part in a pair gives only half a fill to the position it serves while it is lost to every
/// other (the R-2R ladder's 10k parts: 7 singles or 2 per 20k leg).
/// </summary>
internal static class SupplyBound
{
    /// <summary>The bound, or int.MaxValue when the programme could not be solved.</summary>
    /// <param name="recipe">The recipe.</param>
    /// <param name="usable">Usable parts.</param>
    /// <param name="singleClasses">Per part, the class bit mask it may fill as a single (filtered).</param>
    /// <param name="classOf">Class of each position.</param>
    /// <param name="options">Nominal matching.</param>
    public static int Compute(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        int[] singleClasses,
        int[] classOf,
        AssemblyOptions options
    )
    {
        var positions = recipe.Positions.Count;
        var types = new Dictionary<(ulong Single, ulong Half), int>();
        for (var i = 0; i < usable.Count; i++)
        {
            ulong single = 0,
                half = 0;
            for (var k = 0; k < positions; k++)
            {
                var pos = recipe.Positions[k];
                single |= (singleClasses[i] >> classOf[k] & 1) == 1 ? 1UL << k : 0;
                var nominal = usable[i].Nominal;
                var paired =
                    (pos.Pairs.HasFlag(PairBuilds.Series) && options.SameNominal(nominal, pos.Nominal / 2))
                    || (pos.Pairs.HasFlag(PairBuilds.Parallel) && options.SameNominal(nominal, pos.Nominal * 2));
                half |= paired ? 1UL << k : 0;
            }

            if (single != 0 || half != 0)
            {
                types[(single, half)] = types.GetValueOrDefault((single, half)) + 1;
            }
        }

        var typeList = types.ToList();
        // Columns: 0 = N, then one per (position, type, single | half) that is allowed.
        var columns = new List<(int Position, int Type, bool Half)>();
        for (var t = 0; t < typeList.Count; t++)
        {
            for (var k = 0; k < positions; k++)
            {
                if ((typeList[t].Key.Single >> k & 1) == 1)
                {
                    columns.Add((k, t, false));
                }

                if ((typeList[t].Key.Half >> k & 1) == 1)
                {
                    columns.Add((k, t, true));
                }
            }
        }

        var n = columns.Count + 1;
        var rows = new double[positions + typeList.Count][];
        var b = new double[rows.Length];
        for (var r = 0; r < rows.Length; r++)
        {
            rows[r] = new double[n];
        }

        for (var k = 0; k < positions; k++)
        {
            rows[k][0] = 1;
        }

        for (var t = 0; t < typeList.Count; t++)
        {
            b[positions + t] = typeList[t].Value;
        }

        for (var j = 0; j < columns.Count; j++)
        {
            var (k, t, half) = columns[j];
            rows[k][j + 1] = half ? -0.5 : -1;
            rows[positions + t][j + 1] = 1;
        }

        var c = new double[n];
        c[0] = 1;
        var value = DenseSimplex.Maximize(c, rows, b);
        return double.IsFinite(value) ? (int)Math.Floor(value + 1e-6) : int.MaxValue;
    }
}
