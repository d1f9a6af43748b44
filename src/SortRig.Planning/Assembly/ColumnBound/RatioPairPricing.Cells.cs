using SortRig.Planning.Networks;

namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// The ratio prefilter of <see cref="RatioPairPricing"/>: before the option pairs are built, the range of one side's
/// ratio is cut into <see cref="Cells"/> cells of equal log width, and a cell is kept only when the box of that cell
/// and the other side's whole ratio range can meet every output, each on its own (<see cref="BoxVertices.CanMeet"/>,
/// exact at the vertices by monotonicity). A pair whose ratio lies in a dropped cell is in no member of the family;
/// a ratio is looked up with its neighbouring cells too, so rounding at a cell's edge can only keep a pair.
/// </summary>
internal sealed partial class RatioPairPricing
{
    private const int Cells = 512;

    private static (double Lo, double Hi) Span(Option[] first, Option[] second) =>
        (second.Min(o => o.Value) / first.Max(o => o.Value), second.Max(o => o.Value) / first.Min(o => o.Value));

    private Func<double, bool> Admissible(double lo, double hi, double otherLo, double otherHi, bool sideA)
    {
        if (!(hi > lo * (1 + 1e-9)))
        {
            return _ => true;
        }

        var step = Math.Log(hi / lo) / Cells;
        var keep = new bool[Cells];
        var (l, h) = ((double[])_nominal.Clone(), (double[])_nominal.Clone());
        var (own, other) = sideA ? (_p.J, _p.L) : (_p.L, _p.J);
        var (ownBase, otherBase) = sideA ? (_nominal[_p.I], _nominal[_p.K]) : (_nominal[_p.K], _nominal[_p.I]);
        (l[other], h[other]) = (otherLo * otherBase, otherHi * otherBase);
        for (var c = 0; c < Cells; c++)
        {
            l[own] = lo * Math.Exp(c * step) * ownBase;
            h[own] = lo * Math.Exp((c + 1) * step) * ownBase;
            keep[c] = BoxVertices.CanMeet(_network, l, h, _tolerance);
        }

        return r =>
        {
            var c = (int)Math.Clamp(Math.Floor(Math.Log(r / lo) / step), 0, Cells - 1);
            return keep[c] || (c > 0 && keep[c - 1]) || (c < Cells - 1 && keep[c + 1]);
        };
    }
}
