using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Factorization;

namespace SortRig.Planning.Networks;

/// <summary>
/// One factorised MNA matrix for one set of resistances: solves for any drive, and gives the derivative of any
/// linear functional c·x with respect to each resistance by the adjoint method: with Aᵀλ = c,
/// d(c·x)/dR = (λa − λb)(xa − xb) / R² for a resistor between nodes a and b.
/// </summary>
internal sealed class MnaFactor
{
    private readonly MnaSystem _system;
    private readonly double[] _resistances;
    private readonly LU<double> _lu;
    private LU<double>? _luTransposed;
    private readonly Matrix<double> _matrix;

    public MnaFactor(MnaSystem system, ReadOnlySpan<double> resistances)
    {
        _system = system;
        _resistances = resistances.ToArray();
        _matrix = system.Matrix(resistances);
        _lu = _matrix.LU();
        if (!(Math.Abs(_lu.Determinant) > 0) || double.IsNaN(_lu.Determinant))
        {
            throw new InvalidOperationException(
                "the network is singular: some node has no DC path to ground, or sources/op-amps over-constrain a node"
            );
        }
    }

    /// <summary>Unknown vector x for a drive (node voltages first).</summary>
    public Vector<double> Solve(IReadOnlyDictionary<string, double>? drive) => _lu.Solve(_system.Rhs(drive));

    /// <summary>d(c·x)/dR for every resistor, given the solution x for the drive of interest.</summary>
    public double[] Gradient(Vector<double> c, Vector<double> x)
    {
        _luTransposed ??= _matrix.Transpose().LU();
        var lambda = _luTransposed.Solve(c);
        var grad = new double[_resistances.Length];
        for (var r = 0; r < grad.Length; r++)
        {
            var (a, b) = _system.ResistorNodes[r];
            var dl = At(lambda, a) - At(lambda, b);
            var dx = At(x, a) - At(x, b);
            grad[r] = dl * dx / (_resistances[r] * _resistances[r]);
        }

        return grad;
    }

    private static double At(Vector<double> v, int i) => i < 0 ? 0.0 : v[i];
}
