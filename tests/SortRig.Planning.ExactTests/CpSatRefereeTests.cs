using Google.OrTools.Sat;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.ExactTests;

/// <summary>
/// Outside referee: Google OR-Tools CP-SAT solves the matched-form packing from first principles (one candidate per
/// set and position, each part at most once, every two candidates of a set within ln(1 + tolerance) in log units,
/// which is the interval hull condition),
/// maximising the number of sets. The assembler must reach the same count, and its tie-break score must be no worse
/// than that of CP-SAT's solution judged by the same rule.
/// </summary>
public sealed class CpSatRefereeTests
{
    private const double Scale = 1e9;

    private static readonly string[] s_shapes =
    [
        "  - { name: A, nominal: 10k }\n  - { name: B, nominal: 10k }\n  - { name: C, nominal: 10k }\n",
        "  - { name: A, nominal: 10k }\n  - { name: B, nominal: 20k }\n  - { name: C, nominal: 10k }\n",
        "  - { name: A, nominal: 10k, pairs: [parallel] }\n  - { name: B, nominal: 10k, pairs: [parallel] }\n",
        "  - { name: A, nominal: 10k, pairs: [parallel] }\n  - { name: B, nominal: 20k, pairs: [series] }\n  - { "
            + "name: C, nominal: 10k }\n",
    ];

    public static TheoryData<int> Cases => new(Enumerable.Range(0, 32));

    [Theory]
    [MemberData(nameof(Cases))]
    public void ExactAssembler_MatchesCpSat(int seed)
    {
        var rng = new Random(90_000 + seed);
        var recipe = RecipeLoader.Load(
            $"recipe: cp{seed}\nform: matched\nmatch-ppm: 1000\npositions:\n{s_shapes[seed % s_shapes.Length]}",
            "cp.yaml"
        );
        var parts = Parts(rng, rng.Next(9, 13));
        var mine = new SetAssembler().Assemble(recipe, parts);
        var (count, cpScore) = SolveWithCpSat(recipe, parts);
        Assert.Equal(AssemblyMethod.Exact, mine.Method);
        Assert.Equal(count, mine.Sets.Count);
        Assert.True(
            mine.TotalScore <= cpScore + 1e-9,
            $"assembler score {mine.TotalScore} > CP-SAT solution's {cpScore}"
        );
    }

    [Theory]
    [MemberData(nameof(Larger))]
    public void ReelScaleSearch_BoundNeverBelowCpSatOptimum_SetsNeverAbove(int seed)
    {
        // The reel-scale path (exact search off, windows that hold two sets) on 12 parts, more than the brute force
        // can take: its proven bound must not fall below CP-SAT's optimum, its count must not exceed it.
        var rng = new Random(95_000 + seed);
        var recipe = RecipeLoader.Load(
            $"recipe: cpl{seed}\nform: matched\nmatch-ppm: 1000\npositions:\n{s_shapes[seed % s_shapes.Length]}",
            "cpl.yaml"
        );
        var parts = Parts(rng, 12);
        var mine = new SetAssembler(
            new AssemblyOptions(exactPartLimit: 0, neighbourhoodParts: 2 * recipe.Positions.Count)
        ).Assemble(recipe, parts);
        // Under load CP-SAT may stop at its time limit: then its best solution and its own bound bracket the optimum.
        var (found, cpBound) = SolveWithCpSat(recipe, parts, requireOptimal: false);
        Assert.True(mine.Sets.Count <= cpBound, $"{mine.Sets.Count} sets > CP-SAT bound {cpBound}");
        Assert.True(mine.UpperBound >= found, $"bound {mine.UpperBound} < CP-SAT's {found} sets ({mine.BoundMethod})");
    }

    public static TheoryData<int> Larger => new(Enumerable.Range(0, 12));

    private static List<PartCandidate> Parts(Random rng, int count) =>
        Enumerable
            .Range(1, count)
            .Select(i =>
            {
                var n = rng.Next(3) == 0 ? 20e3 : 10e3;
                var v =
                    n
                    * (
                        1
                        + (
                            700e-6
                            * Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble()))
                            * Math.Cos(2 * Math.PI * rng.NextDouble())
                        )
                    );
                var u = v * rng.NextDouble() * 120e-6;
                return new PartCandidate(i, n, new MeasuredValue(v, u, u / 2), null);
            })
            .ToList();

    private sealed record Cand(int[] Parts, double Value, double U, double Nominal)
    {
        public double LinLo => (Value - U) / Nominal;

        public double LinHi => (Value + U) / Nominal;
    }

    private static List<Cand> Candidates(PositionSpec pos, List<PartCandidate> parts)
    {
        var list = parts
            .Select((p, i) => (p, i))
            .Where(t => t.p.Nominal == pos.Nominal)
            .Select(t => new Cand([t.i], t.p.Value.Value, t.p.Value.ExpandedTransfer, pos.Nominal))
            .ToList();
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

            var idx = Enumerable.Range(0, parts.Count).Where(i => parts[i].Nominal == partNominal).ToList();
            foreach (var a in idx)
            {
                foreach (var b in idx.Where(b => b > a))
                {
                    double r1 = parts[a].Value.Value,
                        r2 = parts[b].Value.Value,
                        u1 = parts[a].Value.ExpandedTransfer,
                        u2 = parts[b].Value.ExpandedTransfer;
                    list.Add(
                        flag == PairBuilds.Series
                            ? new Cand([a, b], r1 + r2, u1 + u2, pos.Nominal)
                            : new Cand(
                                [a, b],
                                r1 * r2 / (r1 + r2),
                                (Math.Pow(r2 / (r1 + r2), 2) * u1) + (Math.Pow(r1 / (r1 + r2), 2) * u2),
                                pos.Nominal
                            )
                    );
                }
            }
        }

        return list.Where(c => c.LinLo > 0).ToList();
    }

    private static (int Count, double Score) SolveWithCpSat(Recipe recipe, List<PartCandidate> parts)
    {
        var (_, _, count, score) = Solve(recipe, parts, requireOptimal: true);
        return (count, score);
    }

    private static (int Found, int Bound) SolveWithCpSat(Recipe recipe, List<PartCandidate> parts, bool requireOptimal)
    {
        var (found, bound, _, _) = Solve(recipe, parts, requireOptimal);
        return (found, bound);
    }

    private static (int Found, int Bound, int Count, double Score) Solve(
        Recipe recipe,
        List<PartCandidate> parts,
        bool requireOptimal
    )
    {
        var model = new CpModel();
        var cands = recipe.Positions.Select(p => Candidates(p, parts)).ToList();
        var maxSets = parts.Count / recipe.Positions.Count;
        var window = (long)Math.Floor(Math.Log(1 + (recipe.MatchTolerancePpm * 1e-6)) * Scale);
        var y = new BoolVar[maxSets];
        var x = new BoolVar[maxSets][][];
        var usage = Enumerable.Range(0, parts.Count).Select(_ => new List<ILiteral>()).ToList();
        for (var s = 0; s < maxSets; s++)
        {
            y[s] = model.NewBoolVar($"y{s}");
            x[s] = new BoolVar[recipe.Positions.Count][];
            var chosen = new List<(BoolVar Var, Cand Cand)>();
            for (var k = 0; k < recipe.Positions.Count; k++)
            {
                x[s][k] = cands[k].Select((c, i) => model.NewBoolVar($"x{s}_{k}_{i}")).ToArray();
                model.Add(LinearExpr.Sum(x[s][k]) == y[s]);
                for (var i = 0; i < cands[k].Count; i++)
                {
                    chosen.Add((x[s][k][i], cands[k][i]));
                    foreach (var p in cands[k][i].Parts)
                    {
                        usage[p].Add(x[s][k][i]);
                    }
                }

                // Identical neighbouring positions take their candidates in increasing order (symmetry breaking).
                var prev = k > 0 ? recipe.Positions[k - 1] : null;
                if (
                    prev is not null
                    && prev.Nominal == recipe.Positions[k].Nominal
                    && prev.Pairs == recipe.Positions[k].Pairs
                )
                {
                    var weights = Enumerable.Range(0, cands[k].Count).Select(i => (long)i).ToArray();
                    model
                        .Add(LinearExpr.WeightedSum(x[s][k - 1], weights) < LinearExpr.WeightedSum(x[s][k], weights))
                        .OnlyEnforceIf(y[s]);
                }
            }

            // The hull of a set's intervals (log units) fits the window iff every two chosen candidates fit together.
            for (var a = 0; a < chosen.Count; a++)
            {
                for (var b = a; b < chosen.Count; b++)
                {
                    var hull =
                        Math.Log(Math.Max(chosen[a].Cand.LinHi, chosen[b].Cand.LinHi))
                        - Math.Log(Math.Min(chosen[a].Cand.LinLo, chosen[b].Cand.LinLo));
                    if ((long)Math.Round(hull * Scale) > window)
                    {
                        model.AddBoolOr(a == b ? [chosen[a].Var.Not()] : [chosen[a].Var.Not(), chosen[b].Var.Not()]);
                    }
                }
            }

            if (s > 0)
            {
                model.Add(y[s - 1] >= y[s]);
            }
        }

        foreach (var u in usage.Where(u => u.Count > 1))
        {
            model.AddAtMostOne(u);
        }

        model.Maximize(LinearExpr.Sum(y));
        var solver = new CpSolver { StringParameters = "num_workers:2,max_time_in_seconds:60" };
        var status = solver.Solve(model);
        if (requireOptimal)
        {
            Assert.Equal(CpSolverStatus.Optimal, status);
        }

        Assert.True(status is CpSolverStatus.Optimal or CpSolverStatus.Feasible, $"CP-SAT: {status}");
        var (found, bound) = (
            (int)Math.Round(solver.ObjectiveValue),
            (int)Math.Floor(solver.BestObjectiveBound + 1e-6)
        );

        var count = 0;
        var score = 0.0;
        for (var s = 0; s < maxSets; s++)
        {
            if (!solver.BooleanValue(y[s]))
            {
                continue;
            }

            count++;
            var chosen = Enumerable
                .Range(0, recipe.Positions.Count)
                .Select(k => cands[k][Array.FindIndex(x[s][k], v => solver.BooleanValue(v))])
                .ToList();
            score += ((chosen.Max(c => c.LinHi) / chosen.Min(c => c.LinLo)) - 1) * 1e6 / recipe.MatchTolerancePpm;
        }

        return (found, bound, count, score);
    }
}
