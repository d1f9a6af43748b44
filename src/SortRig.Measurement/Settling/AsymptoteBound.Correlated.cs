using MathNet.Numerics.LinearAlgebra;

namespace SortRig.Measurement.Settling;

public static partial class AsymptoteBound
{
    /// <summary>
    /// The bound on var(final) from the first 1, 2, …, n readings (element i uses readings 0..i; +∞ while they do not
    /// determine the parameters) when the readings carry <paramref name="noise"/>: white noise plus stationary
    /// Ornstein-Uhlenbeck components. The Fisher information of Gaussian readings of covariance Σ is Gᵀ Σ⁻¹ G (Kay
    /// 1993, Fundamentals of Statistical Signal Processing vol. 1, sec. 3.9, from memory). It is accumulated reading by
    /// reading with a Kalman filter whose state is the components (their Markov property): each column of G is run
    /// through the filter as if it were data, and its innovations, divided by their variance, are the whitened rows.
    /// The gains depend on the reading times alone, so one pass serves every n. With no components the elements equal
    /// <see cref="Variance"/> of the same readings. Every element is +∞ when the white part's sigma is not positive or
    /// a component's variance is negative or its correlation time not positive.
    /// </summary>
    public static double[] Variances(ReadOnlySpan<double> times, IReadOnlyList<RecoveryPath> paths, ReadingNoise noise)
    {
        ArgumentNullException.ThrowIfNull(paths);
        ArgumentNullException.ThrowIfNull(noise);
        var columns = 1 + paths.Sum(p => p.TimeConstantKnown ? 1 : 2);
        var result = new double[times.Length];
        Array.Fill(result, double.PositiveInfinity);
        var white = noise.WhiteSigma * noise.WhiteSigma;
        var components = noise.Components;
        if (!(white > 0) || components.Any(c => !(c.Variance >= 0) || !(c.CorrelationTime > 0)))
        {
            return result;
        }

        var priors = paths.Count(p => !p.TimeConstantKnown && double.IsFinite(p.LogTimeConstantSd));
        var m = components.Count;
        var covariance = Matrix<double>.Build.DenseOfDiagonalArray(components.Select(c => c.Variance).ToArray());
        var state = Matrix<double>.Build.Dense(m, columns); // the filter's estimate of the components, per column
        var info = Matrix<double>.Build.Dense(columns, columns);
        var g = new double[columns];
        var innovation = new double[columns];
        var gain = new double[m];
        for (var i = 0; i < times.Length; i++)
        {
            if (i > 0)
            {
                Propagate(components, times[i] - times[i - 1], covariance, state);
            }

            Gradient(times[i], paths, g);
            var rowSums = covariance.RowSums(); // P1
            var spread = white + rowSums.Sum(); // 1ᵀP1 + σ²: the innovation's variance
            var columnSums = state.ColumnSums();
            for (var j = 0; j < columns; j++)
            {
                innovation[j] = g[j] - columnSums[j];
            }

            for (var k = 0; k < m; k++)
            {
                gain[k] = rowSums[k] / spread;
            }

            for (var k = 0; k < m; k++)
            {
                for (var j = 0; j < columns; j++)
                {
                    state[k, j] += gain[k] * innovation[j];
                }

                for (var l = 0; l < m; l++)
                {
                    covariance[k, l] -= gain[k] * rowSums[l];
                }
            }

            for (var a = 0; a < columns; a++)
            {
                for (var b = 0; b < columns; b++)
                {
                    info[a, b] += innovation[a] * innovation[b] / spread;
                }
            }

            if (i + 1 + priors >= columns)
            {
                var withPriors = info.Clone();
                AddPriors(withPriors, paths);
                result[i] = InverseCorner(withPriors);
            }
        }

        return result;
    }

    /// <summary>Moves the filter over dt seconds: each component decays by exp(−dt / θ) and gains the variance that
    /// keeps it stationary.</summary>
    private static void Propagate(
        IReadOnlyList<CorrelatedNoise> components,
        double dt,
        Matrix<double> covariance,
        Matrix<double> state
    )
    {
        var m = components.Count;
        var decay = new double[m];
        for (var k = 0; k < m; k++)
        {
            decay[k] = Math.Exp(-Math.Max(dt, 0) / components[k].CorrelationTime);
            state.SetRow(k, state.Row(k) * decay[k]);
        }

        for (var k = 0; k < m; k++)
        {
            for (var l = 0; l < m; l++)
            {
                covariance[k, l] *= decay[k] * decay[l];
            }

            covariance[k, k] += components[k].Variance * (1 - (decay[k] * decay[k]));
        }
    }
}
