using MathNet.Numerics.Distributions;

namespace SortRig.Planning.Cups;

/// <summary>
/// The bands of one nominal in the adaptive planner and the parts seen so far. Bands sit on a lattice of the log
/// scale (<see cref="LogPpm"/>) with a step of 1/<see cref="StepsPerBand"/> band (1/<see cref="TilingStepsPerBand"/>
/// when the K bands tile the stock tolerance, <see cref="Tiles"/>); each is exactly as wide as the
/// match tolerance allows (ratio of its edges 1 + tolerance, less a hair for rounding). A band that holds parts never
/// moves (with <see cref="AdaptiveCupOptions.FollowParts"/> it may, but always holding every part of its cup); the
/// bands of empty cups are placed again (<see cref="Replan"/>) from the grown sample.
/// </summary>
internal sealed class NominalBands
{
    private const int StepsPerBand = 20;

    // When the bands tile the tolerance, neighbours overlap by a lattice step so that no part straddles the seam
    // between them; a step of 1/50 band (20 ppm at 0.1 %) spends no more of the tolerance on each overlap than the 2U a
    // part straddles (at 1/20, 50 ppm, a uniform reel lost 3.5 sets at K = 20; docs/planning.md).
    private const int TilingStepsPerBand = 50;
    private readonly int _steps;
    private readonly AdaptiveCupOptions _options;
    private readonly double _width;
    private readonly double _step;
    private readonly int _firstIndex;
    private readonly int _points;
    private readonly double _range;
    private int _plannedAt;

    public NominalBands(double nominal, AdaptiveCupOptions options)
    {
        _options = options;
        Nominal = nominal;
        PartsPerSet = options.PartsPerSet[nominal];
        // A thousandth of a ppm below the limit, so that rounding in the edges never lets a cup exceed it.
        _width = LogPpm.From(options.MatchTolerancePpm) - 1e-3;
        var range = _range = options.StockTolerancePercent * 1e4;
        // Within a (coarse) lattice step of tiling the whole tolerance.
        Tiles = (options.CupCount * _width) + (_width / StepsPerBand) >= LogPpm.From(range) - LogPpm.From(-range);
        _steps = Tiles ? TilingStepsPerBand : StepsPerBand;
        _step = _width / _steps;
        _firstIndex = (int)Math.Floor((LogPpm.From(-range) - _width) / _step);
        _points = (int)Math.Ceiling(LogPpm.From(range) / _step) - _firstIndex + 1;
    }

    public double Nominal { get; }

    public int PartsPerSet { get; }

    /// <summary>Parts accepted so far: deviation and expanded uncertainty, ppm.</summary>
    public List<(long Part, double Dev, double U)> Samples { get; } = [];

    /// <summary>Every band: those holding parts and the planned bands of empty cups.</summary>
    public List<Band> Bands { get; } = [];

    /// <summary>
    /// True when bands holding parts may move (<see cref="AdaptiveCupOptions.FollowParts"/>). Not when the K bands can
    /// tile the whole stock tolerance (to within a lattice step, the plan's resolution): then there is no choice of
    /// where to cover, only the risk of leaving gaps between bands that moved, so the planner keeps today's rule.
    /// </summary>
    public bool Follows => _options.FollowParts && !Tiles;

    /// <summary>
    /// True when the K bands can tile the whole stock tolerance (to within a twentieth of a band). Then the empty cups'
    /// bands are planned on the finer lattice and neighbouring planned bands may overlap by one step
    /// (<see cref="WindowCover.BestOverlapping"/>), where the parts the overlap saves from the seam are worth the
    /// tolerance it spends (the estimate decides, e.g. yes at a normal reel's centre, no on a flat reel).
    /// </summary>
    public bool Tiles { get; }

    /// <summary>
    /// True when the sample has grown enough since the last plan to place the empty cups' bands again: at every
    /// part up to the learn count, then each time it has grown by a tenth.
    /// </summary>
    public bool Stale =>
        Samples.Count <= _options.LearnCount ? Samples.Count != _plannedAt : Samples.Count >= _plannedAt * 1.1;

    /// <summary>
    /// Places the empty cups' bands where most coming parts are expected. Bands with parts stay, unless
    /// <paramref name="hulls"/> is given (<see cref="AdaptiveCupOptions.FollowParts"/>): then such bands first move,
    /// when that covers more of the coming parts, to lattice places that still hold every part of their cups.
    /// </summary>
    /// <param name="isEmpty">Whether a cup holds no part.</param>
    /// <param name="hulls">Lowest and highest edge (ppm) of the parts' uncertainty intervals in each cup that holds
    /// parts; null to keep those bands where they are.</param>
    public void Replan(Func<string, bool> isEmpty, IReadOnlyDictionary<string, (double Lo, double Hi)>? hulls = null)
    {
        _plannedAt = Samples.Count;
        Bands.RemoveAll(b => isEmpty(b.Label));
        var free = _options.CupCount - Bands.Count;
        if (hulls is not null && Follows)
        {
            MoveHeld(hulls, free);
        }

        if (free == 0)
        {
            return;
        }

        var centres = Centres();
        var first = _firstIndex * _step;
        var held = Bands.Select(b => (LogPpm.From(b.Lo), LogPpm.From(b.Hi))).OrderBy(b => b.Item1).ToList();
        // A planned band may overlap bands that hold parts: it is worth only the parts they would not take (the
        // estimate leaves those out), so the DP moves it off them unless the ground it adds is worth more, e.g. a band
        // opened from the first parts whose lattice left the dense edge of a hump half covered.
        var gains = Estimate(centres, first, held, _width);
        var allowed = Enumerable.Repeat(true, _points).ToList();
        // Tiling: a band may overlap the previous one by a step; what fits that step would be counted twice.
        var plan = Tiles
            ? WindowCover.BestOverlapping(gains, Estimate(centres, first, held, _step), _steps, allowed, free)
            : WindowCover.Best(gains, _steps, allowed, free);
        foreach (var j in plan.Starts)
        {
            var s = first + (j * _step);
            Open(LogPpm.ToPpm(s), LogPpm.ToPpm(s + _width));
        }
    }

    // FollowParts: every band that holds parts, has a lattice place holding its cup's hull and shares no range of parts
    // with another cup may move. The exact DP (WindowCover.BestAround) places these bands, each within the places
    // that hold its hull, together with the free bands, none overlapping, on the estimate that leaves out what the
    // other bands (pinned) take. They move only when that plan covers more of the coming parts than the same DP with
    // them where they are; the free bands are then placed by today's rule (Replan goes on), which may overlap them.
    private void MoveHeld(IReadOnlyDictionary<string, (double Lo, double Hi)> hulls, int free)
    {
        var first = _firstIndex * _step;
        var movable = new List<(Band Band, int Lo, int Hi, int Here)>();
        foreach (var band in Bands)
        {
            var (lo, hi) = hulls[band.Label];
            var a = (int)Math.Ceiling(((LogPpm.From(hi) - _width - first) / _step) - 1e-9);
            var b = (int)Math.Floor(((LogPpm.From(lo) - first) / _step) + 1e-9);
            // The band's edges in ppm decide, as in Band.Fits: step inwards until they hold the hull exactly.
            while (a <= b && LogPpm.ToPpm(first + (a * _step) + _width) < hi)
            {
                a++;
            }

            while (a <= b && LogPpm.ToPpm(first + (b * _step)) > lo)
            {
                b--;
            }

            // A band on the lattice whose parts no other cup's parts overlap can move (two cups holding parts in the
            // same range, after bands were opened overlapping, stay where they are).
            var here = (LogPpm.From(band.Lo) - first) / _step;
            var overlaps = Bands.Any(o => o != band && hulls[o.Label].Lo < hi && lo < hulls[o.Label].Hi);
            if (a <= b && a >= 0 && b < _points && Math.Abs(here - Math.Round(here)) < 1e-6 && !overlaps)
            {
                movable.Add((band, a, b, (int)Math.Round(here)));
            }
        }

        if (movable.Count == 0)
        {
            return;
        }

        movable.Sort((x, y) => (x.Lo, x.Hi).CompareTo((y.Lo, y.Hi)));
        var pinned = Bands
            .Where(b => movable.All(m => m.Band != b))
            .Select(b => (LogPpm.From(b.Lo), LogPpm.From(b.Hi)))
            .OrderBy(b => b.Item1)
            .ToList();
        var centres = Centres();
        var gains = Estimate(centres, first, pinned, _width);
        var plan = WindowCover.BestAround(gains, _steps, free, [.. movable.Select(m => (m.Lo, m.Hi))]);
        // The plan of today's rule for comparison: the movable bands where they are (overlaps counted twice, which
        // only favours staying) and the free bands clear of them.
        var allowed = Enumerable
            .Range(0, _points)
            .Select(j => movable.All(m => j + _steps <= m.Here || j >= m.Here + _steps))
            .ToList();
        var stay = movable.Sum(m => gains[m.Here]) + WindowCover.Best(gains, _steps, allowed, free).Total;
        // Moving is worth it only when the moved plan covers more of the coming parts than the bands where they are.
        if (plan is null || plan.Value.Total <= stay)
        {
            return;
        }

        foreach (var (m, j) in movable.Zip(plan.Value.Required))
        {
            var s = first + (j * _step);
            Bands[Bands.IndexOf(m.Band)] = m.Band with { Lo = LogPpm.ToPpm(s), Hi = LogPpm.ToPpm(s + _width) };
        }
    }

    private List<(double Centre, double Half)> Centres() =>
        [
            .. Samples.Select(s =>
            {
                var (lo, hi) = (LogPpm.From(s.Dev - s.U), LogPpm.From(s.Dev + s.U));
                return ((lo + hi) / 2, (hi - lo) / 2);
            }),
        ];

    /// <summary>
    /// A band for a cup the history names but the plan does not have (a restart after parts were taken back): the
    /// lattice band holding the part's interval nearest to centred on it.
    /// </summary>
    public Band OpenFor(string label, double dev, double u)
    {
        var index = CupLabels.IndexOf(label);
        if (index < 0 || index >= _options.CupCount)
        {
            throw new ArgumentException(
                $"cup label '{label}' is not one of the {_options.CupCount} cups",
                nameof(label)
            );
        }

        Bands.RemoveAll(b => b.Label == label);
        var centre = (LogPpm.From(dev - u) + LogPpm.From(dev + u)) / 2;
        var s = Math.Round((centre - (_width / 2)) / _step) * _step;
        var band = new Band(index, label, LogPpm.ToPpm(s), LogPpm.ToPpm(s + _width));
        Bands.Add(band);
        return band;
    }

    /// <summary>
    /// The band of <paramref name="label"/> moved as little as it must (on the log scale, off the lattice if need be)
    /// to hold [<paramref name="lo"/>, <paramref name="hi"/>] ppm; a hull wider than a band cannot be held and leaves
    /// the band where it is.
    /// </summary>
    public Band Cover(string label, double lo, double hi)
    {
        var i = Bands.FindIndex(b => b.Label == label);
        var band = Bands[i];
        var (a, b) = (LogPpm.From(lo), LogPpm.From(hi));
        if (b - a > _width)
        {
            return band;
        }

        var s = Math.Clamp(LogPpm.From(band.Lo), b - _width, a);
        // Rounding of the edges back to ppm must not leave either end of the hull outside.
        // A millionth of a ppm outside the hull, so that a value recomputed from ohms still lies inside (the band
        // stays within the tolerance: its width has a thousandth of a ppm to spare).
        var moved = band with
        {
            Lo = Math.Min(lo, LogPpm.ToPpm(s)) - 1e-6,
            Hi = Math.Max(hi, LogPpm.ToPpm(s + _width)) + 1e-6,
        };
        Bands[i] = moved;
        return moved;
    }

    /// <summary>
    /// Whether the cup of <paramref name="band"/>, holding parts over <paramref name="hull"/> (ppm), can take a part
    /// outside its band: the hull with the part's interval no wider than a band, and within the band widened by
    /// <paramref name="slack"/> ppm either side.
    /// </summary>
    public bool CanHold(Band band, (double Lo, double Hi) hull, double dev, double u, double slack)
    {
        var (lo, hi) = (Math.Min(hull.Lo, dev - u), Math.Max(hull.Hi, dev + u));
        return LogPpm.From(hi) - LogPpm.From(lo) <= _width && lo >= band.Lo - slack && hi <= band.Hi + slack;
    }

    // The kernel density of the parts seen, plus while the sample is small (weights fading as learn count / (learn
    // count + n)) the same parts mirrored about the nominal, since a lot is made about its nominal and tighter parts
    // are binned out of it symmetrically (common practice, no source), and for the very first parts a prior of 5 parts
    // about the nominal with σ = a third of the tolerance (no source). Once a hole around the nominal is found
    // (<see cref="ReelModel"/>) the prior is the fitted model instead, with the mirror's weight added, and each part's
    // kernel is reflected at the hole's edge.
    private double[] Estimate(
        List<(double Centre, double Half)> centres,
        double first,
        List<(double, double)> held,
        double width
    )
    {
        var n = centres.Count;
        const double Prior = 5;
        var (lo, hi) = (LogPpm.From(-_range), LogPpm.From(_range));
        var model = n >= 1 ? ReelModel.Fit([.. centres.Select(c => c.Centre)], lo, hi, (_range / 3, Prior)) : null;
        var hole = model?.Hole ?? 0;
        var gains = CoverageEstimate.Gains(centres, first, _step, _points, width, _range / 3, held, hole);
        List<(double, double)> mirrored = [.. centres.Select(c => (LogPpm.From(-LogPpm.ToPpm(c.Centre)), c.Half))];
        var mirror = CoverageEstimate.Gains(mirrored, first, _step, _points, width, _range / 3, held, hole);
        var half = n > 0 ? centres.Min(c => c.Half) : 0;
        var m = n * (double)_options.LearnCount / (_options.LearnCount + n);
        Func<double, double> cdf = model is { Hole: > 0 } ? model.Cdf : x => Normal.CDF(0, _range / 3, x);
        for (var j = 0; j < _points; j++)
        {
            var s = first + (j * _step);
            var prior = width > 2 * half ? cdf(s + width - half) - cdf(s + half) : 0;
            if (prior > 0)
            {
                var (a, b) = (s + half, s + width - half);
                prior -= CoverageEstimate.Covered(cdf, a, b, half, held);
            }

            // A found hole's model is fitted to the same parts as the mirror, so it gets the mirror's weight too.
            var w = model is { Hole: > 0 } ? Prior + m : Prior;
            gains[j] = ((n * gains[j]) + (m * mirror[j]) + (w * prior)) / (n + m + w);
        }

        return gains;
    }

    private void Open(double lo, double hi)
    {
        var index = Enumerable.Range(0, _options.CupCount).First(i => Bands.All(b => b.Index != i));
        Bands.Add(new Band(index, CupLabels.For(index), lo, hi));
    }

    /// <summary>One cup's band, ppm from nominal: a part goes in only if [dev − U, dev + U] lies in [Lo, Hi].</summary>
    internal sealed record Band(int Index, string Label, double Lo, double Hi)
    {
        public bool Fits(double dev, double u) => dev - u >= Lo && dev + u <= Hi;
    }
}
