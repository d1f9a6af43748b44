namespace SortRig.Planning.Networks;

/// <summary>
/// Can some point of a box of position values bring every output's error within its tolerance, each output on its
/// own? With the other resistances fixed every output is linear-fractional, so monotone, in one resistance; so the
/// extremes of each error over a box lie at its vertices and the question is decided exactly there (push each
/// coordinate in turn to the end that does not decrease the error). Used to prune in the part filter and in the
/// column bound's network pricing. Pure.
/// </summary>
internal static class BoxVertices
{
    /// <summary>
    /// False only when some output's error is, at every vertex of [<paramref name="lo"/>, <paramref name="hi"/>],
    /// beyond its <paramref name="tolerance"/> on the same side; a non-finite error (a singular vertex) keeps the box.
    /// </summary>
    /// <param name="network">The recipe's network.</param>
    /// <param name="lo">Lowest value of each position, ohms (recipe order).</param>
    /// <param name="hi">Highest value of each position, ohms; equal to <paramref name="lo"/> where fixed.</param>
    /// <param name="tolerance">Each output's tolerance, any widening for rounding included.</param>
    public static bool CanMeet(RecipeNetwork network, double[] lo, double[] hi, ReadOnlySpan<double> tolerance)
    {
        var free = Enumerable.Range(0, lo.Length).Where(i => lo[i] < hi[i]).ToArray();
        var outputs = tolerance.Length;
        Span<double> min = stackalloc double[outputs];
        Span<double> max = stackalloc double[outputs];
        Span<double> e = stackalloc double[outputs];
        min.Fill(double.PositiveInfinity);
        max.Fill(double.NegativeInfinity);
        var x = new double[lo.Length];
        for (var vertex = 0; vertex < 1 << free.Length; vertex++)
        {
            Array.Copy(lo, x, x.Length);
            for (var f = 0; f < free.Length; f++)
            {
                x[free[f]] = (vertex >> f & 1) == 1 ? hi[free[f]] : lo[free[f]];
            }

            network.Errors(x, e);
            for (var o = 0; o < outputs; o++)
            {
                min[o] = Math.Min(min[o], e[o]);
                max[o] = Math.Max(max[o], e[o]);
            }
        }

        for (var o = 0; o < outputs; o++)
        {
            if (
                double.IsFinite(min[o])
                && double.IsFinite(max[o])
                && !(min[o] <= tolerance[o] && max[o] >= -tolerance[o])
            )
            {
                return false;
            }
        }

        return true;
    }
}
