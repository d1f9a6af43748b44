using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Ordering;

/// <summary>
/// How many parts to buy for N matched sets: seeded Monte Carlo trials, each buying parts from the stock distribution
/// and handing them to the real <see cref="SetAssembler"/>. Per trial, the smallest order (in sets' worth of parts,
/// every nominal in its per-set proportion) that makes N sets is found by doubling then bisection over prefixes of one
/// seeded stream per nominal; the order at confidence c is the c-quantile of those. Pure computation; repeatable by
/// seed (trials are independent and seeded by index, so the thread count does not change the result).
/// </summary>
/// <param name="timeProvider">Clock for the elapsed time; null for the system clock.</param>
public sealed partial class OrderEstimator(TimeProvider? timeProvider = null)
{
    private readonly TimeProvider _time = timeProvider ?? TimeProvider.System;

    /// <summary>Estimates the order.</summary>
    /// <param name="recipe">A loaded recipe.</param>
    /// <param name="options">Sets wanted, stock, uncertainty, trials, seed, prices.</param>
    /// <param name="cancellationToken">Stops the estimate (throws).</param>
    /// <exception cref="OrderRefusedException">The question has no answer: the part cap cannot hold N sets, the
    /// tolerance is tighter than the meter resolves, or a pilot reel at the cap makes fewer than N sets (the stock
    /// cannot meet the recipe).</exception>
    public OrderEstimate Estimate(Recipe recipe, OrderOptions options, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        ArgumentNullException.ThrowIfNull(options);
        var started = _time.GetTimestamp();
        var classes = recipe
            .SinglePartDemand.OrderBy(kv => kv.Key)
            .Select(kv => (Nominal: kv.Key, PerSet: kv.Value))
            .ToArray();
        var perSet = classes.Sum(c => c.PerSet);
        var n = options.SetsWanted;
        var cap = options.MaxParts / perSet;
        if (cap < n)
        {
            throw new OrderRefusedException(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"max-parts: {options.MaxParts} parts hold only {cap} set(s) of {perSet} parts; {n} sets need at "
                        + $"least {n * perSet}"
                )
            );
        }

        var assembler = new SetAssembler(options.Assembly);
        OrderChecks.Resolvable(recipe, options.TransferUncertainty, assembler, cancellationToken);
        var pilot = Sets(
            assembler,
            recipe,
            new TrialReel(classes, options.Stock, options.TransferUncertainty, options.Seed, -1).Order(cap),
            cancellationToken
        );
        if (pilot < n)
        {
            var why =
                pilot == 0
                    ? "not one set (the recipe's specs lie outside what this stock reaches, or the cap is too small)"
                    : FormattableString.Invariant($"only {pilot} set(s)");
            throw new OrderRefusedException(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"the stock ({options.Stock.Describe()}) cannot make {n} sets of '{recipe.Name}': {cap * perSet} "
                        + $"parts (the max-parts cap) gave {why}; loosen the recipe, choose a tighter stock or raise "
                        + $"max-parts"
                )
            );
        }

        // Pass 1: each trial's smallest order (int.MaxValue when the cap is not enough).
        var smallest = new int[options.Trials];
        RunTrials(
            options,
            "quantities",
            started,
            t =>
                smallest[t] = SmallestOrder(
                    new TrialReel(classes, options.Stock, options.TransferUncertainty, options.Seed, t),
                    recipe,
                    n,
                    cap,
                    assembler,
                    cancellationToken
                ),
            cancellationToken
        );

        var sorted = smallest.Order().ToArray();
        int? levelOrder(double c) =>
            sorted[Math.Max(0, (int)Math.Ceiling(c * sorted.Length) - 1)] is var m && m <= cap ? m : null;
        var levelOrders = OrderOptions.Levels.Select(levelOrder).ToArray();
        var grid = CurveGrid(n, levelOrders[^1] ?? cap, cap, options.CurvePoints);
        var probes = grid.Concat(levelOrders.OfType<int>()).Distinct().Order().ToArray();

        // Pass 2: sets made and parts left over at every probed order size.
        var sets = new int[options.Trials, probes.Length];
        var leftover = new double[options.Trials, probes.Length, classes.Length];
        RunTrials(
            options,
            "leftovers and curve",
            started,
            t =>
            {
                var reel = new TrialReel(classes, options.Stock, options.TransferUncertainty, options.Seed, t);
                for (var k = 0; k < probes.Length; k++)
                {
                    var result = assembler.Assemble(recipe, reel.Order(probes[k]), cancellationToken);
                    sets[t, k] = result.Sets.Count;
                    var used = new int[classes.Length];
                    foreach (var part in result.Sets.Take(n).SelectMany(s => s.Fills).SelectMany(f => f.Parts))
                    {
                        used[TrialReel.ClassOf(part)]++;
                    }

                    for (var j = 0; j < classes.Length; j++)
                    {
                        leftover[t, k, j] = (probes[k] * classes[j].PerSet) - used[j];
                    }
                }
            },
            cancellationToken
        );

        var levels = OrderOptions
            .Levels.Select((c, i) => Level(c, levelOrders[i], classes, probes, sets, leftover, n, options))
            .ToList();
        if (options.PerNominal && classes.Length > 1)
        {
            levels = [.. levels.Select(l => Trim(l, recipe, classes, assembler, options, started, cancellationToken))];
        }

        var curve = grid.Select(m =>
            {
                var k = Array.IndexOf(probes, m);
                var made = Enumerable.Range(0, options.Trials).Select(t => sets[t, k]).Order().ToArray();
                return new OrderCurvePoint(
                    m,
                    m * perSet,
                    made.Average(),
                    Quantile(made, 0.05),
                    Quantile(made, 0.5),
                    Quantile(made, 0.95)
                );
            })
            .ToList();
        var reached = smallest.Where(m => m <= cap).ToArray();
        return new OrderEstimate(
            recipe.Name,
            n,
            perSet,
            options.Stock.Describe(),
            options.TransferUncertainty,
            options.Trials,
            options.Seed,
            options.Trials - reached.Length,
            levels,
            curve,
            reached.Length == 0 ? double.NaN : reached.Average(),
            _time.GetElapsedTime(started)
        );
    }

    /// <summary>The smallest order (sets' worth) whose parts make <paramref name="n"/> sets, or int.MaxValue beyond the
    /// cap. Doubling from n, then bisection; exact when the set count never falls as parts are added (true of the
    /// optimum; the sweep is optimal for matched recipes without pairs and equal relative uncertainty).</summary>
    internal static int SmallestOrder(
        TrialReel reel,
        Recipe recipe,
        int n,
        int cap,
        SetAssembler assembler,
        CancellationToken cancellationToken
    )
    {
        if (Sets(assembler, recipe, reel.Order(n), cancellationToken) >= n)
        {
            return n;
        }

        var lo = n;
        var hi = n;
        while (true)
        {
            if (hi >= cap)
            {
                return int.MaxValue;
            }

            lo = hi;
            hi = (int)Math.Min(cap, 2L * hi);
            if (Sets(assembler, recipe, reel.Order(hi), cancellationToken) >= n)
            {
                break;
            }
        }

        while (hi - lo > 1)
        {
            var mid = lo + ((hi - lo) / 2);
            if (Sets(assembler, recipe, reel.Order(mid), cancellationToken) >= n)
            {
                hi = mid;
            }
            else
            {
                lo = mid;
            }
        }

        return hi;
    }

    private static int Sets(
        SetAssembler assembler,
        Recipe recipe,
        List<PartCandidate> parts,
        CancellationToken cancellationToken
    ) => assembler.Assemble(recipe, parts, cancellationToken).Sets.Count;

    private void RunTrials(
        OrderOptions options,
        string phase,
        long started,
        Action<int> trial,
        CancellationToken cancellationToken
    )
    {
        var done = 0;
        var step = Math.Max(1, options.Trials / 20);
        Parallel.For(
            0,
            options.Trials,
            new ParallelOptions
            {
                MaxDegreeOfParallelism = options.MaxParallelism,
                CancellationToken = cancellationToken,
            },
            t =>
            {
                trial(t);
                var d = Interlocked.Increment(ref done);
                if (d % step == 0 || d == options.Trials)
                {
                    options.Progress?.Report(
                        new OrderProgress(phase, d, options.Trials, _time.GetElapsedTime(started))
                    );
                }
            }
        );
    }

    private static OrderLevel Level(
        double confidence,
        int? order,
        (double Nominal, int PerSet)[] classes,
        int[] probes,
        int[,] sets,
        double[,,] leftover,
        int n,
        OrderOptions options
    )
    {
        if (order is not { } m)
        {
            return new OrderLevel(confidence, null, double.NaN, []);
        }

        var k = Array.IndexOf(probes, m);
        var trials = sets.GetLength(0);
        var reached = Enumerable.Range(0, trials).Count(t => sets[t, k] >= n) / (double)trials;
        var lines = classes
            .Select(
                (c, j) => Line(c, m * c.PerSet, Enumerable.Range(0, trials).Average(t => leftover[t, k, j]), options)
            )
            .ToList();
        return new OrderLevel(confidence, m, reached, lines);
    }

    private static OrderLine Line((double Nominal, int PerSet) c, int quantity, double left, OrderOptions options)
    {
        if (!options.Prices.TryGetValue(c.Nominal, out var prices))
        {
            return new OrderLine(c.Nominal, c.PerSet, quantity, left, null, null, null);
        }

        var cheapest = prices.CheapestAtLeast(quantity);
        var cheaper = cheapest.Quantity != quantity;
        return new OrderLine(
            c.Nominal,
            c.PerSet,
            quantity,
            left,
            prices.Cost(quantity),
            cheaper ? cheapest.Quantity : null,
            cheaper ? cheapest.Cost : null
        );
    }

    /// <summary>Order sizes for the curve: from half the sets wanted to a quarter beyond the 99 % order, evenly
    /// spaced.</summary>
    private static int[] CurveGrid(int n, int top, int cap, int points)
    {
        var from = Math.Max(1, n / 2);
        var to = Math.Min(cap, Math.Max(from + 1, (int)Math.Ceiling(top * 1.25)));
        return Enumerable
            .Range(0, points)
            .Select(i => from + (int)Math.Round((to - from) * i / (double)(points - 1)))
            .Distinct()
            .ToArray();
    }

    /// <summary>Order statistic at probability p of sorted values (the smallest x with at least p of the values ≤
    /// x).</summary>
    internal static int Quantile(int[] sorted, double p) =>
        sorted[Math.Clamp((int)Math.Ceiling(p * sorted.Length) - 1, 0, sorted.Length - 1)];
}
