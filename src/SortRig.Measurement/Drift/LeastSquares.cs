using MathNet.Numerics;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearRegression;

namespace SortRig.Measurement.Drift;

/// <summary>Ordinary least squares with coefficient standard errors from s^2 (X^T X)^-1.</summary>
internal static class LeastSquares
{
    /// <summary>Straight line y = a + b x by MathNet Fit.Line; returns (a, b with SE, residual SD).</summary>
    public static (double Intercept, Coefficient Slope, double ResidualStdDev) Line(double[] x, double[] y)
    {
        (double a, double b) = Fit.Line(x, y);
        double mean = x.Average();
        double sxx = x.Sum(v => (v - mean) * (v - mean));
        double s = ResidualStdDev(y, x.Select(v => a + (b * v)), parameters: 2);
        return (a, new Coefficient(b, s / Math.Sqrt(sxx)), s);
    }

    /// <summary>Multiple regression y = X beta (X includes the intercept column) by MathNet QR.</summary>
    public static (Coefficient[] Beta, double ResidualStdDev) Multiple(double[][] columns, double[] y)
    {
        Matrix<double> design = Matrix<double>.Build.DenseOfColumnArrays(columns);
        Vector<double> observed = Vector<double>.Build.DenseOfArray(y);
        Vector<double> beta = MultipleRegression.QR(design, observed);
        Vector<double> fitted = design * beta;
        double s = ResidualStdDev(y, fitted, columns.Length);
        Matrix<double> inverse = (design.TransposeThisAndMultiply(design)).Inverse();
        var result = new Coefficient[beta.Count];
        for (int i = 0; i < beta.Count; i++)
        {
            result[i] = new Coefficient(beta[i], s * Math.Sqrt(inverse[i, i]));
        }

        return (result, s);
    }

    private static double ResidualStdDev(double[] y, IEnumerable<double> fitted, int parameters)
    {
        double sse = y.Zip(fitted, (o, f) => (o - f) * (o - f)).Sum();
        int dof = y.Length - parameters;
        return dof > 0 ? Math.Sqrt(sse / dof) : double.NaN;
    }
}
