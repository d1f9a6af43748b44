namespace SortRig.Planning.Cups;

/// <summary>The bands of one nominal in the adaptive planner, and what it has learned so far.</summary>
internal sealed class NominalBands(double nominal, AdaptiveCupOptions options)
{
    public double Nominal { get; } = nominal;

    public int PartsPerSet { get; } = options.PartsPerSet[nominal];

    public List<(long Part, double Dev)> Samples { get; } = [];

    public List<Band> Bands { get; } = [];

    public bool Learned { get; private set; }

    private double Width => options.MatchTolerancePpm;

    private double Anchor => -options.CupCount * Width / 2;

    public Band? Find(double dev) => Bands.FirstOrDefault(b => dev >= b.Lo && dev < b.Hi);

    /// <summary>
    /// Before the first learning: opens the centred-grid band holding <paramref name="dev"/> (the layout of
    /// <see cref="BandCupAssigner"/>, band i labelled as cup i); null outside the K centred bands.
    /// </summary>
    public Band? TryOpenGridBand(double dev)
    {
        var i = (int)Math.Floor((dev - Anchor) / Width);
        if (i < 0 || i >= options.CupCount || Bands.Any(b => b.Index == i))
        {
            return null;
        }

        var band = new Band(i, CupLabels.For(i), Anchor + (i * Width), Anchor + ((i + 1) * Width));
        Bands.Add(band);
        return band;
    }

    /// <summary>True when the sample count has reached the learn count times a power of two.</summary>
    public bool DueToLearn => Samples.Count >= options.LearnCount && (Samples.Count % options.LearnCount) == 0
        && int.IsPow2(Samples.Count / options.LearnCount);

    /// <summary>
    /// Places the bands of every empty cup from the distribution learned so far (first at the learn count, then again
    /// at twice, four times ... as many parts); bands holding parts never move.
    /// </summary>
    public void Learn(Func<string, bool> isEmpty)
    {
        Learned = true;
        Bands.RemoveAll(b => isEmpty(b.Label));
        var free = options.CupCount - Bands.Count;
        var placed = BandPlacer.Place(Samples.Select(s => s.Dev).ToList(), Bands.Select(b => (b.Lo, b.Hi)).ToList(), free, Width, options.StockTolerancePercent * 1e4, Anchor);
        foreach (var (lo, hi) in placed)
        {
            Open(lo, hi);
        }
    }

    private Band Open(double lo, double hi)
    {
        var index = Enumerable.Range(0, options.CupCount).First(i => Bands.All(b => b.Index != i));
        var band = new Band(index, CupLabels.For(index), lo, hi);
        Bands.Add(band);
        return band;
    }

    /// <summary>One cup's band, ppm from nominal, [Lo, Hi).</summary>
    internal sealed record Band(int Index, string Label, double Lo, double Hi);
}
