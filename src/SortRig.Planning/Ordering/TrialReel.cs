using MathNet.Numerics.Random;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;

namespace SortRig.Planning.Ordering;

/// <summary>
/// The parts one trial could buy: per nominal an endless, seeded stream of values, so that a smaller order is always
/// the first parts of a larger one (the prefix property the search for the smallest order relies on).
/// </summary>
internal sealed class TrialReel
{
    private readonly (double Nominal, int PerSet)[] _classes;
    private readonly Random[] _random;
    private readonly List<PartCandidate>[] _drawn;
    private readonly StockDistribution _stock;
    private readonly double _uncertainty;

    public TrialReel(
        (double Nominal, int PerSet)[] classes,
        StockDistribution stock,
        double uncertainty,
        int seed,
        int trial
    )
    {
        _classes = classes;
        _stock = stock;
        _uncertainty = uncertainty;
        _random = classes
            .Select((_, j) => (Random)new Xoshiro256StarStar(Mix(seed, trial, j), threadSafe: false))
            .ToArray();
        _drawn = classes.Select(_ => new List<PartCandidate>()).ToArray();
    }

    /// <summary>The first <paramref name="setEquivalents"/> × per-set parts of every nominal.</summary>
    public List<PartCandidate> Order(int setEquivalents) =>
        Order(_classes.Select(c => setEquivalents * c.PerSet).ToArray());

    /// <summary>The first <paramref name="quantities"/>[j] parts of nominal class j.</summary>
    public List<PartCandidate> Order(int[] quantities)
    {
        var parts = new List<PartCandidate>();
        for (var j = 0; j < _classes.Length; j++)
        {
            var want = quantities[j];
            while (_drawn[j].Count < want)
            {
                var nominal = _classes[j].Nominal;
                var value = nominal * (1 + _stock.Draw(_random[j]));

                // The transfer uncertainty is stored as a standard uncertainty with k = 2 (MeasuredValue's default).
                var u = value * _uncertainty / 2;
                _drawn[j]
                    .Add(
                        new PartCandidate(
                            ((long)j << 32) + _drawn[j].Count,
                            nominal,
                            new MeasuredValue(value, u, u),
                            null
                        )
                    );
            }

            parts.AddRange(_drawn[j].Take(want));
        }

        return parts;
    }

    /// <summary>Index of the nominal class of a part made here.</summary>
    public static int ClassOf(PartCandidate part) => (int)(part.Id >> 32);

    // SplitMix64 finaliser: nearby (seed, trial, class) triples give unrelated streams.
    private static int Mix(int seed, int trial, int j)
    {
        var z = unchecked(((ulong)(uint)seed * 0x9E3779B97F4A7C15UL) ^ ((ulong)(uint)trial << 20) ^ (ulong)(uint)j);
        z = unchecked((z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL);
        z = unchecked((z ^ (z >> 27)) * 0x94D049BB133111EBUL);
        return unchecked((int)(z ^ (z >> 31)));
    }
}
