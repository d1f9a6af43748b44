namespace SortRig.Planning.Networks;

/// <summary>
/// Finds, for a 4-position network, two disjoint position pairs (I, J) and (K, L) such that scaling either pair by one
/// factor leaves every output unchanged, so every output depends only on the ratios a = R_J / R_I and b = R_L / R_K
/// (as for an ideal op-amp difference amplifier, whose outputs depend on R2/R1 and R4/R3 only: textbook). Decided
/// numerically from the network itself: at a few seeded random deviations (up to ±2 %) from the nominal values, each
/// output is evaluated with both pairs unscaled and with each pair scaled (by 1.37 and 0.61); each output must agree
/// with itself to 1e-11 relative (rounding in the network solve is about 1e-15). Pure.
/// </summary>
internal static class ScalePairs
{
    private const int Points = 4;
    private const double Agree = 1e-11;

    /// <summary>The pairs (I, J, K, L) in recipe order, or null when the network has not exactly 4 positions or no
    /// pairing is scale-invariant.</summary>
    public static (int I, int J, int K, int L)? Find(RecipeNetwork network, IReadOnlyList<double> nominal)
    {
        if (nominal.Count != 4)
        {
            return null;
        }

        (int, int, int, int)[] pairings = [(0, 1, 2, 3), (0, 2, 1, 3), (0, 3, 1, 2)];
        foreach (var p in pairings)
        {
            if (Invariant(network, nominal, p))
            {
                return p;
            }
        }

        return null;
    }

    private static bool Invariant(RecipeNetwork network, IReadOnlyList<double> nominal, (int I, int J, int K, int L) p)
    {
        var rng = new Random(4_117);
        for (var point = 0; point < Points; point++)
        {
            var x = nominal.Select(v => v * (1 + (0.04 * (rng.NextDouble() - 0.5)))).ToArray();
            var plain = Values(network, x);
            foreach (var (first, factor) in new[] { (true, 1.37), (false, 0.61) })
            {
                var y = (double[])x.Clone();
                var (u, v) = first ? (p.I, p.J) : (p.K, p.L);
                y[u] *= factor;
                y[v] *= factor;
                var scaled = Values(network, y);
                for (var o = 0; o < plain.Length; o++)
                {
                    var scale = Math.Max(Math.Abs(plain[o]), Math.Abs(scaled[o]));
                    if (!double.IsFinite(plain[o]) || !(Math.Abs(plain[o] - scaled[o]) <= Agree * scale))
                    {
                        return false;
                    }
                }
            }
        }

        return true;
    }

    private static double[] Values(RecipeNetwork network, double[] x) => [.. network.Evaluate(x).Select(o => o.Value)];
}
