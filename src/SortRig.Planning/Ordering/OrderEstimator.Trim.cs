using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Ordering;

public sealed partial class OrderEstimator
{
    /// <summary>
    /// Trims a level's quantities one nominal at a time (by rising nominal): the smallest quantity of that nominal, the
    /// others as they stand, with which at least the level's share of the same trials still makes N sets (bisection,
    /// each step one pass over the trials, stopped early once too many trials failed). Every accepted step keeps the
    /// share, so the final order does too. The trials that chose the quantities also judge them, so the share is
    /// slightly optimistic.
    /// </summary>
    private OrderLevel Trim(
        OrderLevel level,
        Recipe recipe,
        (double Nominal, int PerSet)[] classes,
        SetAssembler assembler,
        OrderOptions options,
        long started,
        CancellationToken cancellationToken
    )
    {
        if (level.SetEquivalents is not { } m)
        {
            return level;
        }

        var n = options.SetsWanted;
        var quantities = classes.Select(c => m * c.PerSet).ToArray();
        for (var j = 0; j < classes.Length; j++)
        {
            var lo = (n * classes[j].PerSet) - 1;
            var hi = quantities[j];
            while (hi - lo > 1)
            {
                var mid = lo + ((hi - lo) / 2);
                var trial = (int[])quantities.Clone();
                trial[j] = mid;
                if (Reaches(trial, level.Confidence, recipe, classes, assembler, options, cancellationToken))
                {
                    hi = mid;
                }
                else
                {
                    lo = mid;
                }
            }

            quantities[j] = hi;
            options.Progress?.Report(
                new OrderProgress(
                    FormattableString.Invariant($"per-nominal trim at {level.Confidence * 100:0} %"),
                    j + 1,
                    classes.Length,
                    _time.GetElapsedTime(started)
                )
            );
        }

        // Share reached and leftovers of the trimmed order, over every trial.
        var made = new bool[options.Trials];
        var leftover = new double[options.Trials, classes.Length];
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
                var result = assembler.Assemble(recipe, Reel(classes, options, t).Order(quantities), cancellationToken);
                made[t] = result.Sets.Count >= n;
                var used = new int[classes.Length];
                foreach (var part in result.Sets.Take(n).SelectMany(s => s.Fills).SelectMany(f => f.Parts))
                {
                    used[TrialReel.ClassOf(part)]++;
                }

                for (var c = 0; c < classes.Length; c++)
                {
                    leftover[t, c] = quantities[c] - used[c];
                }
            }
        );

        var lines = classes
            .Select(
                (c, j) =>
                    Line(c, quantities[j], Enumerable.Range(0, options.Trials).Average(t => leftover[t, j]), options)
            )
            .ToList();
        return new OrderLevel(level.Confidence, m, made.Count(x => x) / (double)options.Trials, lines, Trimmed: true);
    }

    private static bool Reaches(
        int[] quantities,
        double confidence,
        Recipe recipe,
        (double Nominal, int PerSet)[] classes,
        SetAssembler assembler,
        OrderOptions options,
        CancellationToken cancellationToken
    )
    {
        // More failures than this and the share is below the confidence, whichever trials they are.
        var allowed = options.Trials - (int)Math.Ceiling(confidence * options.Trials);
        var failed = 0;
        Parallel.For(
            0,
            options.Trials,
            new ParallelOptions
            {
                MaxDegreeOfParallelism = options.MaxParallelism,
                CancellationToken = cancellationToken,
            },
            (t, state) =>
            {
                if (Volatile.Read(ref failed) > allowed)
                {
                    state.Stop();
                    return;
                }

                if (
                    assembler
                        .Assemble(recipe, Reel(classes, options, t).Order(quantities), cancellationToken)
                        .Sets.Count < options.SetsWanted
                )
                {
                    Interlocked.Increment(ref failed);
                }
            }
        );
        return failed <= allowed;
    }

    private static TrialReel Reel((double Nominal, int PerSet)[] classes, OrderOptions options, int t) =>
        new(classes, options.Stock, options.TransferUncertainty, options.Seed, t);
}
