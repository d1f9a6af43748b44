namespace SortRig.Planning.Assembly.Packing;

/// <summary>
/// Exact cover with secondary items by Knuth's Algorithm X on dancing links ("Dancing Links", 2000; textbook): choose
/// options so that every primary item lies in exactly one and every secondary item in at most one; the primary item
/// with the fewest options left is branched on first. Pure computation.
/// </summary>
internal sealed class ExactCover
{
    private readonly int[] _l;
    private readonly int[] _r;
    private readonly int[] _u;
    private readonly int[] _d;
    private readonly int[] _col;
    private readonly int[] _row;
    private readonly int[] _size;
    private readonly List<int> _chosen = [];
    private long _nodes;

    /// <param name="items">Number of items (indices 0 .. items - 1).</param>
    /// <param name="primary">True for an item that must be covered exactly once.</param>
    /// <param name="options">Each option's distinct items.</param>
    public ExactCover(int items, Func<int, bool> primary, IReadOnlyList<int[]> options)
    {
        var nodes = 1 + items + options.Sum(o => o.Length);
        (_l, _r, _u, _d, _col, _row) = (
            new int[nodes],
            new int[nodes],
            new int[nodes],
            new int[nodes],
            new int[nodes],
            new int[nodes]
        );
        _size = new int[items + 1];
        _l[0] = _r[0] = 0;
        for (var c = 1; c <= items; c++)
        {
            _u[c] = _d[c] = c;
            _col[c] = c;
            if (primary(c - 1))
            {
                // Link into the root's list of items still to cover.
                _l[c] = _l[0];
                _r[c] = 0;
                _r[_l[0]] = c;
                _l[0] = c;
            }
            else
            {
                _l[c] = _r[c] = c;
            }
        }

        var next = items + 1;
        for (var o = 0; o < options.Count; o++)
        {
            var first = next;
            foreach (var item in options[o])
            {
                var c = item + 1;
                var n = next++;
                (_col[n], _row[n]) = (c, o);
                (_u[n], _d[n]) = (_u[c], c);
                _d[_u[c]] = n;
                _u[c] = n;
                _size[c]++;
                (_l[n], _r[n]) = n == first ? (n, n) : (_l[first], first);
                _r[_l[n]] = n;
                _l[first] = n;
            }
        }
    }

    /// <summary>Search nodes visited by the last <see cref="Solve"/>.</summary>
    public long Nodes => _nodes;

    /// <summary>One exact cover (option indices), or null when there is none or <paramref name="stop"/> said so
    /// first (<paramref name="complete"/> tells which).</summary>
    public List<int>? Solve(Func<bool> stop, out bool complete)
    {
        _nodes = 0;
        _chosen.Clear();
        var outcome = Search(stop);
        complete = outcome != null;
        return outcome == true ? [.. _chosen] : null;
    }

    // True: found; false: none below; null: stopped.
    private bool? Search(Func<bool> stop)
    {
        if (_r[0] == 0)
        {
            return true;
        }

        if ((++_nodes & 1023) == 0 && stop())
        {
            return null;
        }

        var best = -1;
        for (var c = _r[0]; c != 0; c = _r[c])
        {
            if (best < 0 || _size[c] < _size[best])
            {
                best = c;
                if (_size[c] <= 1)
                {
                    break;
                }
            }
        }

        if (_size[best] == 0)
        {
            return false;
        }

        Cover(best);
        bool? result = false;
        for (var r = _d[best]; r != best && result == false; r = _d[r])
        {
            _chosen.Add(_row[r]);
            for (var j = _r[r]; j != r; j = _r[j])
            {
                Cover(_col[j]);
            }

            result = Search(stop);
            if (result == true)
            {
                break;
            }

            for (var j = _l[r]; j != r; j = _l[j])
            {
                Uncover(_col[j]);
            }

            _chosen.RemoveAt(_chosen.Count - 1);
        }

        if (result != true)
        {
            Uncover(best);
        }

        return result;
    }

    private void Cover(int c)
    {
        _r[_l[c]] = _r[c];
        _l[_r[c]] = _l[c];
        for (var i = _d[c]; i != c; i = _d[i])
        {
            for (var j = _r[i]; j != i; j = _r[j])
            {
                _d[_u[j]] = _d[j];
                _u[_d[j]] = _u[j];
                _size[_col[j]]--;
            }
        }
    }

    private void Uncover(int c)
    {
        for (var i = _u[c]; i != c; i = _u[i])
        {
            for (var j = _l[i]; j != i; j = _l[j])
            {
                _size[_col[j]]++;
                _d[_u[j]] = j;
                _u[_d[j]] = j;
            }
        }

        _r[_l[c]] = c;
        _l[_r[c]] = c;
    }
}
