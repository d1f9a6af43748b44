namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>The leaves of <see cref="RatioPairPricing"/>: blocks of a-pairs and their intervals of b-pairs.</summary>
internal sealed partial class RatioPairPricing
{
    private bool Build(Func<bool> stop)
    {
        var (minLo, maxHi) = (int.MaxValue, -1);
        for (var s = 0; s < _a.Count; )
        {
            if ((s & 63) == 0 && stop())
            {
                return false;
            }

            var t = s;
            while (t + 1 < _a.Count && t + 1 - s < BlockSize && _a.R[t + 1] <= _a.R[s] * (1 + BlockSpan))
            {
                t++;
            }

            var (lo, hi) = Interval(_a.R[s], _a.R[t]);
            if (lo <= hi)
            {
                for (var a = s; a <= t; a++)
                {
                    _leaves.Add((a, lo, hi));
                }

                (minLo, maxHi) = (Math.Min(minLo, lo), Math.Max(maxHi, hi));
            }

            s = t + 1;
        }

        if (_leaves.Count == 0)
        {
            return true;
        }

        // Only b-pairs some leaf can take are kept (the range-minimum table is rebuilt every pricing round).
        _b = _b.Slice(minLo, maxHi);
        for (var l = 0; l < _leaves.Count; l++)
        {
            var (a, lo, hi) = _leaves[l];
            _leaves[l] = (a, lo - minLo, hi - minLo);
        }

        return true;
    }

    // The b-pairs [lo, hi] whose ratio can meet every output, each on its own, for some a in [a0, a1] (class comment).
    private (int Lo, int Hi) Interval(double a0, double a1)
    {
        var outputs = _tolerance.Length;
        var (first, last) = (_b.R[0], _b.R[^1]);
        var s0 = Errors(a0, first);
        var s1 = Errors(a0, last);
        var t0 = Errors(a1, first);
        var t1 = Errors(a1, last);
        var dir = new int[outputs];
        for (var o = 0; o < outputs; o++)
        {
            if (!double.IsFinite(s0[o] + s1[o] + t0[o] + t1[o]))
            {
                return (0, _b.Count - 1);
            }

            var (ds, dt) = (Dir(s1[o] - s0[o], o), Dir(t1[o] - t0[o], o));
            if (ds != dt)
            {
                // Not the same direction at both ends of the block: keep every b-pair (a superset).
                return (0, _b.Count - 1);
            }

            dir[o] = ds;
            // (Nearly) constant in b: the extremes over the block's box lie at its corners (monotone in each ratio).
            if (
                ds == 0
                && (
                    Math.Max(Math.Max(s0[o], s1[o]), Math.Max(t0[o], t1[o])) < -_tolerance[o]
                    || Math.Min(Math.Min(s0[o], s1[o]), Math.Min(t0[o], t1[o])) > _tolerance[o]
                )
            )
            {
                return (1, 0);
            }
        }

        // Up: every output's error range over the block past its lower edge (an up-set in b); Down: before its upper
        // edge (a down-set).
        bool Up(double[] s, double[] t)
        {
            for (var o = 0; o < outputs; o++)
            {
                var (min, max) = (Math.Min(s[o], t[o]), Math.Max(s[o], t[o]));
                if ((dir[o] > 0 && max < -_tolerance[o]) || (dir[o] < 0 && min > _tolerance[o]))
                {
                    return false;
                }
            }

            return true;
        }

        bool Down(double[] s, double[] t)
        {
            for (var o = 0; o < outputs; o++)
            {
                var (min, max) = (Math.Min(s[o], t[o]), Math.Max(s[o], t[o]));
                if ((dir[o] > 0 && min > _tolerance[o]) || (dir[o] < 0 && max < -_tolerance[o]))
                {
                    return false;
                }
            }

            return true;
        }

        if (!Up(s1, t1) || !Down(s0, t0))
        {
            return (1, 0);
        }

        // The interval moves little from one block to the next: gallop from the previous block's ends.
        var n = _b.Count;
        var from = Up(s0, t0) ? 0 : FirstTrue(j => Up(Errors(a0, _b.R[j]), Errors(a1, _b.R[j])), n, _guess.Lo);
        var to = Down(s1, t1)
            ? n - 1
            : FirstTrue(j => !Down(Errors(a0, _b.R[j]), Errors(a1, _b.R[j])), n, _guess.Hi + 1) - 1;
        _guess = (from, to);
        return (from, to);
    }

    // Smallest j in [0, n) with p(j), for p false then true and p(n − 1) true: galloping from the guess, then
    // bisection.
    private static int FirstTrue(Func<int, bool> p, int n, int guess)
    {
        guess = Math.Clamp(guess, 0, n - 1);
        int lo,
            hi;
        if (p(guess))
        {
            // p(hi) true; widen to the left until p(lo) is false or lo falls off the start (then lo = −1).
            hi = guess;
            var step = 1;
            lo = hi - step;
            while (lo >= 0 && p(lo))
            {
                (hi, step) = (lo, step * 2);
                lo = hi - step;
            }

            lo = Math.Max(lo, -1);
        }
        else
        {
            lo = guess;
            var step = 1;
            hi = lo + step;
            while (hi < n - 1 && !p(hi))
            {
                (lo, step) = (hi, step * 2);
                hi = lo + step;
            }

            hi = Math.Min(hi, n - 1);
        }

        while (hi - lo > 1)
        {
            var mid = lo + ((hi - lo) / 2);
            (lo, hi) = p(mid) ? (lo, mid) : (mid, hi);
        }

        return hi;
    }

    private int Dir(double d, int o) =>
        Math.Abs(d) <= 1e-9 * _tolerance[o] ? 0
        : d > 0 ? 1
        : -1;

    // Every output's error with the pairs at ratios a and b (the first of each pair at its nominal value): by the scale
    // invariance, the errors of any values with those ratios.
    private double[] Errors(double a, double b)
    {
        var x = (double[])_nominal.Clone();
        x[_p.J] = a * _nominal[_p.I];
        x[_p.L] = b * _nominal[_p.K];
        var e = new double[_tolerance.Length];
        _network.Errors(x, e);
        return e;
    }
}
