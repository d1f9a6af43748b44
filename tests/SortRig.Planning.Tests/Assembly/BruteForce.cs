using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// Referee written apart from the assembler: tries every partition of the parts into blocks (restricted-growth
/// labelling, label 0 = unused), every arrangement of each block onto the positions, and keeps the largest number
/// of feasible blocks, then the smallest sum of scores. Exponential; for 8 parts or fewer.
/// </summary>
internal static class BruteForce
{
    /// <summary>Judge: (value, expanded uncertainty) per position in recipe order → score (≤ 1) or null if
    /// infeasible.</summary>
    public delegate double? Judge(IReadOnlyList<(double Value, double U)> fills);

    public static (int Count, double Score) Solve(Recipe recipe, IReadOnlyList<PartCandidate> parts, Judge judge)
    {
        var labels = new int[parts.Count];
        var cache = new Dictionary<int, double?>();
        (int Count, double Score) best = (0, 0.0);
        Recurse(0, 0);
        return best;

        void Recurse(int i, int maxLabel)
        {
            if (i == parts.Count)
            {
                var blocks = Enumerable
                    .Range(1, maxLabel)
                    .Select(l => Enumerable.Range(0, parts.Count).Where(p => labels[p] == l).Sum(p => 1 << p))
                    .ToList();
                var scores = blocks
                    .Select(m => cache.TryGetValue(m, out var s) ? s : cache[m] = BlockScore(recipe, parts, m, judge))
                    .ToList();
                if (scores.All(s => s.HasValue))
                {
                    var cand = (blocks.Count, scores.Sum(s => s!.Value));
                    if (cand.Count > best.Count || (cand.Count == best.Count && cand.Item2 < best.Score - 1e-12))
                    {
                        best = cand;
                    }
                }

                return;
            }

            labels[i] = 0;
            Recurse(i + 1, maxLabel);
            for (var l = 1; l <= maxLabel + 1; l++)
            {
                labels[i] = l;
                if (labels.Take(i + 1).Count(x => x == l) <= 2 * recipe.Positions.Count)
                {
                    Recurse(i + 1, Math.Max(maxLabel, l));
                }
            }
        }
    }

    internal static double? BlockScore(Recipe recipe, IReadOnlyList<PartCandidate> parts, int mask, Judge judge)
    {
        double? best = null;
        var fills = new (double, double)[recipe.Positions.Count];
        Place(0, mask);
        return best;

        void Place(int k, int remaining)
        {
            if (k == fills.Length)
            {
                if (remaining == 0 && judge(fills) is { } s && (best is null || s < best))
                {
                    best = s;
                }

                return;
            }

            var pos = recipe.Positions[k];
            var free = Enumerable.Range(0, parts.Count).Where(p => (remaining & (1 << p)) != 0).ToList();
            foreach (var p in free.Where(p => parts[p].Nominal == pos.Nominal))
            {
                fills[k] = (parts[p].Value.Value, parts[p].Value.ExpandedTransfer);
                Place(k + 1, remaining & ~(1 << p));
            }

            foreach (
                var (flag, partNominal) in new[]
                {
                    (PairBuilds.Series, pos.Nominal / 2),
                    (PairBuilds.Parallel, pos.Nominal * 2),
                }
            )
            {
                if (!pos.Pairs.HasFlag(flag))
                {
                    continue;
                }

                var ok = free.Where(p => parts[p].Nominal == partNominal).ToList();
                for (var a = 0; a < ok.Count; a++)
                {
                    for (var b = a + 1; b < ok.Count; b++)
                    {
                        double r1 = parts[ok[a]].Value.Value,
                            r2 = parts[ok[b]].Value.Value;
                        double u1 = parts[ok[a]].Value.ExpandedTransfer,
                            u2 = parts[ok[b]].Value.ExpandedTransfer;
                        // Series: R = R1 + R2, U = U1 + U2. Parallel: R = R1R2/(R1+R2), ∂R/∂R1 = (R2/(R1+R2))².
                        fills[k] =
                            flag == PairBuilds.Series
                                ? (r1 + r2, u1 + u2)
                                : (
                                    r1 * r2 / (r1 + r2),
                                    (Math.Pow(r2 / (r1 + r2), 2) * u1) + (Math.Pow(r1 / (r1 + r2), 2) * u2)
                                );
                        Place(k + 1, remaining & ~(1 << ok[a]) & ~(1 << ok[b]));
                    }
                }
            }
        }
    }

    /// <summary>Matched form: worst-case ratio spread max((x+U)/n) / min((x−U)/n) − 1 within the match
    /// tolerance.</summary>
    public static Judge Matched(Recipe recipe) =>
        fills =>
        {
            var hi = fills.Select((f, k) => (f.Value + f.U) / recipe.Positions[k].Nominal).Max();
            var lo = fills.Select((f, k) => (f.Value - f.U) / recipe.Positions[k].Nominal).Min();
            var worstPpm = ((hi / lo) - 1) * 1e6;
            return worstPpm <= recipe.MatchTolerancePpm ? worstPpm / recipe.MatchTolerancePpm : null;
        };

    /// <summary>Two-resistor divider R1 (top), R2 (bottom): ratio R2/(R1+R2) within tolPpm of nominal, worst
    /// case.</summary>
    public static Judge Divider(Recipe recipe, double tolPpm) =>
        fills =>
        {
            double n1 = recipe.Positions[0].Nominal,
                n2 = recipe.Positions[1].Nominal;
            var (r1, u1) = fills[0];
            var (r2, u2) = fills[1];
            var target = n2 / (n1 + n2);
            var y = r2 / (r1 + r2);
            var d1 = r2 / Math.Pow(r1 + r2, 2);
            var d2 = r1 / Math.Pow(r1 + r2, 2);
            var worstPpm = (Math.Abs(y - target) + (d1 * u1) + (d2 * u2)) / target * 1e6;
            return worstPpm <= tolPpm ? worstPpm / tolPpm : null;
        };
}
