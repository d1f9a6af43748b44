namespace SortRig.Measurement.Settling;

/// <summary>
/// Nelder-Mead simplex minimisation in two dimensions with the classical coefficients (reflection 1, expansion 2,
/// contraction ½, shrink ½; Nelder and Mead 1965). A non-finite value counts as +∞, so a constraint can refuse a point.
/// </summary>
internal static class NelderMead2
{
    public static (double X, double Y) Minimum(
        Func<double, double, double> f,
        double x0,
        double y0,
        double step,
        double tolerance,
        int maxEvaluations
    )
    {
        double F(double x, double y) => f(x, y) is var v && double.IsFinite(v) ? v : double.PositiveInfinity;
        var p = new (double X, double Y, double V)[]
        {
            (x0, y0, F(x0, y0)),
            (x0 + step, y0, F(x0 + step, y0)),
            (x0, y0 + step, F(x0, y0 + step)),
        };
        var evaluations = 3;
        while (evaluations < maxEvaluations)
        {
            Array.Sort(p, (a, b) => a.V.CompareTo(b.V));
            var size = Math.Max(
                Math.Max(Math.Abs(p[1].X - p[0].X), Math.Abs(p[2].X - p[0].X)),
                Math.Max(Math.Abs(p[1].Y - p[0].Y), Math.Abs(p[2].Y - p[0].Y))
            );
            if (size < tolerance)
            {
                break;
            }

            var (cx, cy) = ((p[0].X + p[1].X) / 2, (p[0].Y + p[1].Y) / 2);
            var (rx, ry) = (cx + (cx - p[2].X), cy + (cy - p[2].Y));
            var rv = F(rx, ry);
            evaluations++;
            if (rv < p[0].V)
            {
                var (ex, ey) = (cx + (2 * (cx - p[2].X)), cy + (2 * (cy - p[2].Y)));
                var ev = F(ex, ey);
                evaluations++;
                p[2] = ev < rv ? (ex, ey, ev) : (rx, ry, rv);
                continue;
            }

            if (rv < p[1].V)
            {
                p[2] = (rx, ry, rv);
                continue;
            }

            var (kx, ky) = (cx + ((p[2].X - cx) / 2), cy + ((p[2].Y - cy) / 2));
            var kv = F(kx, ky);
            evaluations++;
            if (kv < p[2].V)
            {
                p[2] = (kx, ky, kv);
                continue;
            }

            for (var i = 1; i < 3; i++)
            {
                var (sx, sy) = ((p[0].X + p[i].X) / 2, (p[0].Y + p[i].Y) / 2);
                p[i] = (sx, sy, F(sx, sy));
                evaluations++;
            }
        }

        var best = p.MinBy(q => q.V);
        return (best.X, best.Y);
    }
}
