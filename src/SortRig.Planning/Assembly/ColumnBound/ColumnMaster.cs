namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// The restricted master of the set-packing LP: max Σ_j x_j subject to Σ_{j ∋ i} x_j ≤ 1 for every part i, x ≥ 0,
/// over the columns (sets of parts) added so far. A revised simplex with an explicit dense basis inverse (one row and
/// one slack per part, so the all-slack basis is the identity and the origin is feasible); Dantzig's rule with a
/// tiny seeded perturbation of the right-hand side against stalling on this very degenerate programme. The duals it
/// returns are only a guide for pricing: the bound itself is proven from any y ≥ 0 by <see cref="ColumnBoundSolver"/>,
/// so rounding in the inverse can cost tightness but never validity.
/// </summary>
internal sealed class ColumnMaster
{
    private const double Tol = 1e-9;
    private readonly int _m;
    private readonly double[][] _binv;
    private readonly double[] _xb;
    private readonly int[] _basis; // column index, or -1 - row for a slack
    private readonly double[] _y;
    private readonly List<int[]> _columns = [];
    private readonly HashSet<string> _keys = [];

    public ColumnMaster(int rows, int seed = 1)
    {
        _m = rows;
        _binv = new double[rows][];
        _xb = new double[rows];
        _basis = new int[rows];
        _y = new double[rows];
        var rng = new Random(seed);
        for (var i = 0; i < rows; i++)
        {
            _binv[i] = new double[rows];
            _binv[i][i] = 1;
            _xb[i] = 1 + (1e-4 * rng.NextDouble());
            _basis[i] = -1 - i;
        }
    }

    public int ColumnCount => _columns.Count;

    /// <summary>Every column added so far (sorted part indices).</summary>
    public IReadOnlyList<int[]> AllColumns => _columns;

    /// <summary>The current primal solution, one value per column of <see cref="AllColumns"/> (0 for a nonbasic
    /// column).</summary>
    public double[] Primal()
    {
        var x = new double[_columns.Count];
        for (var r = 0; r < _m; r++)
        {
            if (_basis[r] >= 0)
            {
                x[_basis[r]] = _xb[r];
            }
        }

        return x;
    }

    /// <summary>Master objective Σ x over the basic columns.</summary>
    public double Value
    {
        get
        {
            var v = 0.0;
            for (var r = 0; r < _m; r++)
            {
                v += _basis[r] >= 0 ? _xb[r] : 0;
            }

            return v;
        }
    }

    /// <summary>Current duals (may be slightly negative through rounding; the caller clips).</summary>
    public ReadOnlySpan<double> Duals => _y;

    /// <summary>Adds a column (distinct part indices); false when it is already there.</summary>
    public bool Add(int[] parts)
    {
        var sorted = parts.Order().ToArray();
        if (!_keys.Add(string.Join(',', sorted)))
        {
            return false;
        }

        _columns.Add(sorted);
        return true;
    }

    /// <summary>Pivots until no column prices out or the cap or the stop hits; true when optimal.</summary>
    public bool Solve(int maxPivots, Func<bool> stop)
    {
        var col = new double[_m];
        var stalled = 0;
        for (var pivot = 0; pivot < maxPivots; pivot++)
        {
            if ((pivot & 63) == 0)
            {
                RefreshDuals();
                if (stop())
                {
                    return false;
                }
            }

            // Dantzig's rule; Bland's (lowest index, slacks after columns) after a run of pivots without gain,
            // which cannot cycle, until the objective rises again.
            var bland = stalled > 30;
            var enter = -1;
            var best = Tol;
            for (var j = 0; j < _columns.Count && !(bland && enter >= 0); j++)
            {
                var d = 1.0;
                foreach (var i in _columns[j])
                {
                    d -= _y[i];
                }

                if (d > best)
                {
                    (best, enter) = (d, j);
                }
            }

            var slackRow = -1;
            for (var i = 0; i < _m && !(bland && enter >= 0) && !(bland && slackRow >= 0); i++)
            {
                // A slack prices out when its dual is negative (reduced cost 0 − (−y_i)).
                if (-_y[i] > best)
                {
                    (best, slackRow) = (-_y[i], i);
                }
            }

            if (enter >= 0 && slackRow >= 0 && bland)
            {
                slackRow = -1;
            }
            else if (slackRow >= 0)
            {
                enter = -1;
            }

            if (enter < 0 && slackRow < 0)
            {
                return true;
            }

            Ftran(enter, slackRow, col);
            var leave = -1;
            var ratio = double.PositiveInfinity;
            for (var r = 0; r < _m; r++)
            {
                if (col[r] > Tol)
                {
                    var t = _xb[r] / col[r];
                    var tie = t <= ratio + 1e-12 && leave >= 0;
                    if (
                        t < ratio - 1e-12
                        || (tie && !bland && col[r] > col[leave])
                        || (tie && bland && Code(_basis[r]) < Code(_basis[leave]))
                    )
                    {
                        (ratio, leave) = (t, r);
                    }
                }
            }

            if (leave < 0)
            {
                return false; // cannot happen for a packing programme; stop rather than loop
            }

            // The objective rises by θ times the reduced cost.
            stalled = _xb[leave] / col[leave] * best > 1e-9 ? 0 : stalled + 1;
            Pivot(leave, col, enter >= 0 ? enter : -1 - slackRow, best);
        }

        RefreshDuals();
        return false;
    }

    // Bland's order: columns first, then slacks.
    private int Code(int basic) => basic >= 0 ? basic : _columns.Count - 1 - basic;

    private void Ftran(int column, int slackRow, double[] col)
    {
        for (var r = 0; r < _m; r++)
        {
            if (column >= 0)
            {
                var s = 0.0;
                var row = _binv[r];
                foreach (var i in _columns[column])
                {
                    s += row[i];
                }

                col[r] = s;
            }
            else
            {
                col[r] = _binv[r][slackRow];
            }
        }
    }

    private void Pivot(int leave, double[] col, int entering, double reducedCost)
    {
        var p = col[leave];
        var lrow = _binv[leave];
        // y_new = y + (d_q / α_l) · (row l of the old inverse).
        var f = reducedCost / p;
        for (var i = 0; i < _m; i++)
        {
            _y[i] += f * lrow[i];
        }

        for (var i = 0; i < _m; i++)
        {
            lrow[i] /= p;
        }

        var theta = _xb[leave] / p;
        for (var r = 0; r < _m; r++)
        {
            if (r == leave || col[r] == 0)
            {
                continue;
            }

            var c = col[r];
            var row = _binv[r];
            for (var i = 0; i < _m; i++)
            {
                row[i] -= c * lrow[i];
            }

            _xb[r] = Math.Max(0, _xb[r] - (theta * c));
        }

        _xb[leave] = theta;
        _basis[leave] = entering;
    }

    private void RefreshDuals()
    {
        Array.Clear(_y);
        for (var r = 0; r < _m; r++)
        {
            if (_basis[r] >= 0)
            {
                var row = _binv[r];
                for (var i = 0; i < _m; i++)
                {
                    _y[i] += row[i];
                }
            }
        }
    }
}
