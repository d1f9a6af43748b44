using MathNet.Numerics.LinearAlgebra;

namespace SortRig.Measurement.Settling;

/// <summary>One exponential path of a recovery y(t) = final + Σ amplitude·exp(−t / timeConstant), for
/// <see cref="AsymptoteBound"/>.</summary>
/// <param name="Amplitude">The path's amplitude at t = 0 (same unit as the readings).</param>
/// <param name="TimeConstant">The path's time constant, s.</param>
/// <param name="TimeConstantKnown">True when the time constant is given, not estimated (its column is left
/// out).</param>
/// <param name="LogTimeConstantSd">When finite (and the time constant is not known): a Gaussian prior's standard
/// deviation of ln τ, whose Fisher information 1 / sd² is added to the data's (the Bayesian information of a
/// population of time constants, Van Trees 1968).</param>
public sealed record RecoveryPath(
    double Amplitude,
    double TimeConstant,
    bool TimeConstantKnown = false,
    double LogTimeConstantSd = double.PositiveInfinity
);

/// <summary>
/// The Cramér-Rao lower bound of the variance of a recovery's final value (its asymptote) from readings at given
/// times with white Gaussian noise of a known standard deviation, at given true parameters: the (0, 0) element of the
/// inverse Fisher information J = GᵀG / σ² (+ prior information), where G holds the model's derivatives at each reading
/// with respect to (final, amplitude₁, ln τ₁, amplitude₂, ln τ₂, …). ∂y/∂final = 1, ∂y/∂aᵢ = exp(−t/τᵢ),
/// ∂y/∂ln τᵢ = aᵢ (t/τᵢ) exp(−t/τᵢ). The bound does not depend on how the nuisance parameters are written
/// (ln τ or τ, a or a·c(τ)): a bijective change of them leaves the asymptote's block of the inverse unchanged.
/// Used by the benchmark as an oracle (the settle rules never call it).
/// </summary>
public static partial class AsymptoteBound
{
    /// <summary>The bound on var(final); +∞ when the readings do not determine the parameters (too few, or a singular
    /// information matrix).</summary>
    public static double Variance(ReadOnlySpan<double> times, IReadOnlyList<RecoveryPath> paths, double sigma)
    {
        ArgumentNullException.ThrowIfNull(paths);
        var columns = 1 + paths.Sum(p => p.TimeConstantKnown ? 1 : 2);
        var priors = paths.Count(p => !p.TimeConstantKnown && double.IsFinite(p.LogTimeConstantSd));
        if (times.Length + priors < columns || !(sigma > 0))
        {
            return double.PositiveInfinity;
        }

        var info = Matrix<double>.Build.Dense(columns, columns);
        var g = new double[columns];
        var weight = 1 / (sigma * sigma);
        foreach (var t in times)
        {
            Gradient(t, paths, g);
            for (var i = 0; i < columns; i++)
            {
                for (var j = 0; j <= i; j++)
                {
                    info[i, j] += g[i] * g[j] * weight;
                }
            }
        }

        for (var i = 0; i < columns; i++)
        {
            for (var j = i + 1; j < columns; j++)
            {
                info[i, j] = info[j, i];
            }
        }

        AddPriors(info, paths);
        return InverseCorner(info);
    }

    /// <summary>Adds each prior's information 1 / sd² to its ln τ column.</summary>
    private static void AddPriors(Matrix<double> info, IReadOnlyList<RecoveryPath> paths)
    {
        var column = 1;
        foreach (var path in paths)
        {
            if (path.TimeConstantKnown)
            {
                column++;
                continue;
            }

            if (double.IsFinite(path.LogTimeConstantSd))
            {
                info[column + 1, column + 1] += 1 / (path.LogTimeConstantSd * path.LogTimeConstantSd);
            }

            column += 2;
        }
    }

    private static void Gradient(double t, IReadOnlyList<RecoveryPath> paths, double[] g)
    {
        g[0] = 1;
        var c = 1;
        foreach (var path in paths)
        {
            var e = Math.Exp(-t / path.TimeConstant);
            g[c++] = e;
            if (!path.TimeConstantKnown)
            {
                g[c++] = path.Amplitude * (t / path.TimeConstant) * e;
            }
        }
    }

    /// <summary>(J⁻¹)₀₀ with Jacobi scaling (unit diagonal) before the inverse, so that columns of very different size
    /// (ohms against ohms per unit of ln τ) do not spoil the LU; +∞ when singular.</summary>
    private static double InverseCorner(Matrix<double> info)
    {
        var n = info.RowCount;
        var scale = new double[n];
        for (var i = 0; i < n; i++)
        {
            if (!(info[i, i] > 0))
            {
                return double.PositiveInfinity;
            }

            scale[i] = 1 / Math.Sqrt(info[i, i]);
        }

        var scaled = Matrix<double>.Build.Dense(n, n, (i, j) => info[i, j] * scale[i] * scale[j]);
        var inverse = scaled.Inverse();
        var corner = inverse[0, 0] * scale[0] * scale[0];
        return double.IsFinite(corner) && corner > 0 && inverse.Diagonal().All(d => d > 0)
            ? corner
            : double.PositiveInfinity;
    }
}
