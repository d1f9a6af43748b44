namespace SortRig.Planning.Assembly.Packing;

/// <summary>
/// Most disjoint columns (sets of parts) from a pool: a maximum independent set in the graph where columns sharing a
/// part are joined, by iterated local search with (1,2)-swaps (take one column out, put two in) and random forced
/// insertions, in the manner of Andrade, Resende and Werneck, "Fast local search for the maximum independent set
/// problem" (J. Heuristics 2012; from memory). Heuristic: never proves anything; the caller's bound says how far it may
/// be. Pure computation, seeded, deterministic for a given pool and stop sequence.
/// </summary>
internal sealed class ColumnPacking
{
    private readonly int[][] _adj;
    private readonly bool[] _in;
    private readonly int[] _tight; // solution columns adjacent to each column
    private readonly Random _rng;
    private readonly Queue<int> _queue = new();
    private readonly int[] _mark;
    private int _stamp;
    private int _size;

    /// <param name="columns">The pool: each column's distinct part indices.</param>
    /// <param name="rows">Number of parts (indices run below it).</param>
    /// <param name="seed">Seed of the perturbations.</param>
    public ColumnPacking(IReadOnlyList<int[]> columns, int rows, int seed = 1)
    {
        var byPart = new List<int>[rows];
        for (var j = 0; j < columns.Count; j++)
        {
            foreach (var i in columns[j])
            {
                (byPart[i] ??= []).Add(j);
            }
        }

        _mark = new int[columns.Count];
        _adj = new int[columns.Count][];
        var nb = new List<int>();
        for (var j = 0; j < columns.Count; j++)
        {
            _stamp++;
            _mark[j] = _stamp;
            nb.Clear();
            foreach (var i in columns[j])
            {
                foreach (var k in byPart[i])
                {
                    if (_mark[k] != _stamp)
                    {
                        _mark[k] = _stamp;
                        nb.Add(k);
                    }
                }
            }

            _adj[j] = [.. nb];
        }

        _in = new bool[columns.Count];
        _tight = new int[columns.Count];
        _rng = new Random(seed);
    }

    /// <summary>Perturbation rounds run by the last <see cref="Solve"/>.</summary>
    public long Rounds { get; private set; }

    /// <summary>The best packing found: indices into the pool, pairwise disjoint.</summary>
    /// <param name="start">Pairwise disjoint columns to start from (e.g. the sets already found).</param>
    /// <param name="target">Stop as soon as this many are packed (a proven upper bound).</param>
    /// <param name="stop">True when time is up.</param>
    public List<int> Solve(IEnumerable<int> start, int target, Func<bool> stop)
    {
        Array.Clear(_in);
        Array.Clear(_tight);
        _size = 0;
        foreach (var j in start)
        {
            if (!_in[j] && _tight[j] == 0)
            {
                Insert(j);
            }
        }

        for (var j = 0; j < _in.Length; j++)
        {
            if (!_in[j] && _tight[j] == 0)
            {
                Insert(j);
            }
        }

        ImproveAll();
        var best = (bool[])_in.Clone();
        var bestTight = (int[])_tight.Clone();
        var bestSize = _size;
        Rounds = 0;
        while (bestSize < target && _in.Length > 0 && !((Rounds & 15) == 0 && stop()))
        {
            Rounds++;
            Perturb();
            if (_size > bestSize)
            {
                (bestSize, best, bestTight) = (_size, (bool[])_in.Clone(), (int[])_tight.Clone());
            }
            else if (_size < bestSize - 1 || (_size < bestSize && _rng.Next(2) == 0))
            {
                Array.Copy(best, _in, _in.Length);
                Array.Copy(bestTight, _tight, _tight.Length);
                _size = bestSize;
            }
        }

        var result = new List<int>(bestSize);
        for (var j = 0; j < best.Length; j++)
        {
            if (best[j])
            {
                result.Add(j);
            }
        }

        return result;
    }

    private void Insert(int j)
    {
        _in[j] = true;
        _size++;
        foreach (var k in _adj[j])
        {
            _tight[k]++;
        }
    }

    private void Remove(int j)
    {
        _in[j] = false;
        _size--;
        foreach (var k in _adj[j])
        {
            _tight[k]--;
        }
    }

    // Forces a random column outside the packing in (its packed neighbours out), fills what came free, then swaps.
    private void Perturb()
    {
        int v;
        do
        {
            v = _rng.Next(_in.Length);
        } while (_in[v] && _size < _in.Length);

        if (_in[v])
        {
            return;
        }

        foreach (var k in _adj[v])
        {
            if (_in[k])
            {
                Remove(k);
            }
        }

        Insert(v);
        foreach (var k in _adj[v])
        {
            FillAround(k);
        }

        _queue.Enqueue(v);
        foreach (var k in _adj[v])
        {
            if (_in[k])
            {
                _queue.Enqueue(k);
            }
        }

        Drain();
    }

    // Puts in every column next to a removed one that no longer touches the packing.
    private void FillAround(int removed)
    {
        foreach (var k in _adj[removed])
        {
            if (!_in[k] && _tight[k] == 0)
            {
                Insert(k);
                _queue.Enqueue(k);
            }
        }
    }

    private void ImproveAll()
    {
        for (var j = 0; j < _in.Length; j++)
        {
            if (_in[j])
            {
                _queue.Enqueue(j);
            }
        }

        Drain();
    }

    private void Drain()
    {
        while (_queue.TryDequeue(out var x))
        {
            if (_in[x] && TwoForOne(x))
            {
                continue;
            }
        }
    }

    // (1,2)-swap: two non-adjacent columns whose only packed neighbour is x replace x.
    private bool TwoForOne(int x)
    {
        var free = new List<int>();
        foreach (var u in _adj[x])
        {
            if (!_in[u] && _tight[u] == 1)
            {
                free.Add(u);
            }
        }

        if (free.Count < 2)
        {
            return false;
        }

        for (var a = 0; a < free.Count; a++)
        {
            var u = free[a];
            _stamp++;
            foreach (var k in _adj[u])
            {
                _mark[k] = _stamp;
            }

            for (var b = a + 1; b < free.Count; b++)
            {
                var w = free[b];
                if (_mark[w] == _stamp)
                {
                    continue;
                }

                Remove(x);
                Insert(u);
                Insert(w);
                FillAround(x);
                _queue.Enqueue(u);
                _queue.Enqueue(w);
                foreach (var k in _adj[x])
                {
                    if (_in[k])
                    {
                        _queue.Enqueue(k);
                    }
                }

                return true;
            }
        }

        return false;
    }
}
