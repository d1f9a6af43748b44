namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// A restricted master for packing programmes with general coefficients: max Σ_j x_j subject to A x ≤ 1, x ≥ 0, where
/// a column holds non-negative entries on a few rows (an aggregated row carries a part count divided by the row's
/// capacity, so every right-hand side is 1). A revised simplex with an explicit dense basis inverse (one slack per
/// row, so the all-slack basis is the identity and the origin is feasible); Dantzig's rule, Bland's after a stall,
/// and a tiny seeded perturbation of the right-hand side against stalling on these very degenerate programmes. Its
/// duals are only a guide for pricing: the bound is proven from any y ≥ 0 by pricing, so rounding in the inverse can
/// cost tightness but never validity. <see cref="ColumnMaster"/> is its 0/1 case.
/// </summary>
internal sealed class PackingMaster
{
    private const double Tol = 1e-9;
    private readonly int _m;
    private readonly double[][] _binv;
    private readonly double[] _xb;
    private readonly int[] _basis; // column index, or -1 - row for a slack
    private readonly double[] _y;
    private readonly List<(int[] Rows, double[] Values)> _columns = [];
    private readonly HashSet<string> _keys = [];

    public PackingMaster(int rows, int seed = 1)
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

    /// <summary>The current primal solution, one value per column in the order added (0 for a nonbasic column).
    /// </summary>
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

    /// <summary>Current duals, one per row (may be slightly negative through rounding; the caller clips).</summary>
    public ReadOnlySpan<double> Duals => _y;

    /// <summary>Adds a column given as (row, entry) pairs with distinct rows; false when it is already there.</summary>
    public bool Add(IReadOnlyList<(int Row, double Value)> entries)
    {
        var sorted = entries.Where(e => e.Value != 0).OrderBy(e => e.Row).ToArray();
        var key = string.Join(
            ';',
            sorted.Select(e => string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{e.Row}:{e.Value:R}"))
        );
        if (sorted.Length == 0 || !_keys.Add(key))
        {
            return false;
        }

        _columns.Add((sorted.Select(e => e.Row).ToArray(), sorted.Select(e => e.Value).ToArray()));
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

            var bland = stalled > 30;
            var (enter, slackRow, best) = Entering(bland);
            if (enter < 0 && slackRow < 0)
            {
                return true;
            }

            Ftran(enter, slackRow, col);
            var leave = Leaving(col, bland);
            if (leave < 0)
            {
                return false; // unbounded cannot happen with non-negative columns that touch a row
            }

            stalled = _xb[leave] / col[leave] * best > 1e-9 ? 0 : stalled + 1;
            Pivot(leave, col, enter >= 0 ? enter : -1 - slackRow, best);
        }

        RefreshDuals();
        return false;
    }

    // Dantzig's rule (largest reduced cost), or Bland's (lowest index, columns before slacks) after a stall.
    private (int Enter, int SlackRow, double Best) Entering(bool bland)
    {
        var enter = -1;
        var best = Tol;
        for (var j = 0; j < _columns.Count; j++)
        {
            var (rows, values) = _columns[j];
            var d = 1.0;
            for (var e = 0; e < rows.Length; e++)
            {
                d -= _y[rows[e]] * values[e];
            }

            if (d > best)
            {
                (best, enter) = (d, j);
                if (bland)
                {
                    return (enter, -1, best);
                }
            }
        }

        var slackRow = -1;
        for (var i = 0; i < _m; i++)
        {
            // A slack prices out when its dual is negative (reduced cost 0 − (−y_i)).
            if (-_y[i] > best)
            {
                (best, slackRow) = (-_y[i], i);
                if (bland)
                {
                    break;
                }
            }
        }

        return slackRow >= 0 ? (-1, slackRow, best) : (enter, -1, best);
    }

    private int Leaving(double[] col, bool bland)
    {
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

        return leave;
    }

    private int Code(int basic) => basic >= 0 ? basic : _columns.Count - 1 - basic;

    private void Ftran(int column, int slackRow, double[] col)
    {
        for (var r = 0; r < _m; r++)
        {
            var row = _binv[r];
            if (column >= 0)
            {
                var (rows, values) = _columns[column];
                var s = 0.0;
                for (var e = 0; e < rows.Length; e++)
                {
                    s += row[rows[e]] * values[e];
                }

                col[r] = s;
            }
            else
            {
                col[r] = row[slackRow];
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

    // y = c_B B^-1 with c = 1 on columns and 0 on slacks.
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
