using System.Globalization;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;

namespace SortRig.Planning.Cups;

/// <summary>
/// Online cup planner that learns each nominal's spread. Every band is as wide as the match tolerance allows in the
/// worst case: a part goes into a cup only when its whole uncertainty interval lies in the band, and the band's edges
/// are 1 + tolerance apart as a ratio, so any parts of one cup form a matched set. When a part fits no band that holds
/// parts, the bands of the empty cups are placed again where most of the coming parts are expected (a kernel density
/// of the parts seen, <see cref="CoverageEstimate"/>, and the exact best disjoint windows, <see cref="WindowCover"/>),
/// at every part while learning, then whenever the sample has grown by a tenth; the part opens the planned band it
/// fits, if any. With <see cref="AdaptiveCupOptions.FollowParts"/> (the default) a band holding parts may move at a
/// plan to any lattice place that still holds every part of its cup, and a cup may take a part just across its edge
/// when its parts leave room; without it no band moves once it holds a part. Each nominal has its own K cups;
/// everything else goes to "R".
/// </summary>
public sealed class AdaptiveCupPlanner(AdaptiveCupOptions options, ILogger<AdaptiveCupPlanner>? logger = null)
    : ICupAssigner
{
    private readonly CupLedger _ledger = new();
    private readonly Dictionary<double, NominalBands> _nominals = [];
    private readonly ILogger _logger = (ILogger?)logger ?? NullLogger.Instance;

    /// <inheritdoc />
    public IReadOnlyList<CupCount> Counts =>
        _nominals
            .Values.SelectMany(n =>
                n.Bands.Select(b =>
                {
                    var c = _ledger.Count(n.Nominal, b.Label);
                    return new CupCount(n.Nominal, b.Label, b.Index, false, c, b.Lo, b.Hi, c / n.PartsPerSet);
                })
            )
            .Concat(
                _ledger
                    .NonEmpty.Where(e => e.Key.Label == CupLabels.Reject)
                    .Select(e => new CupCount(
                        e.Key.Nominal,
                        CupLabels.Reject,
                        options.CupCount,
                        true,
                        e.Count,
                        double.NaN,
                        double.NaN,
                        0
                    ))
            )
            .ToList();

    /// <summary>The bands of a nominal so far (label, low and high edge in ppm); empty before its first part.</summary>
    public IReadOnlyList<(string Label, double LowPpm, double HighPpm)> Bands(double nominal) =>
        _nominals.TryGetValue(nominal, out var n)
            ? n.Bands.OrderBy(b => b.Lo).Select(b => (b.Label, b.Lo, b.Hi)).ToList()
            : [];

    /// <inheritdoc />
    public CupDecision Assign(CupRequest request) => Place(request, forcedLabel: null);

    /// <inheritdoc />
    public void Restore(IReadOnlyList<(CupRequest Part, string CupLabel)> history)
    {
        _ledger.Clear();
        _nominals.Clear();
        foreach (var (part, label) in history)
        {
            Place(part, label);
        }
    }

    /// <inheritdoc />
    public void Undo(long partNumber)
    {
        var entry = _ledger.Remove(partNumber);
        if (_nominals.TryGetValue(entry.Key, out var n))
        {
            n.Samples.RemoveAll(s => s.Part == partNumber);
        }
    }

    private CupDecision Place(CupRequest r, string? forcedLabel)
    {
        _ledger.EnsureNew(r.PartNumber);
        var key = options.PartsPerSet.Keys.FirstOrDefault(k => Math.Abs(k - r.Nominal) <= k * 1e-4);
        if (key == 0)
        {
            var nominal = r.Nominal.ToString(CultureInfo.InvariantCulture);
            return Record(r, 0, null, $"nominal {nominal} ohm is not in the plan", forcedLabel);
        }

        if (!_nominals.TryGetValue(key, out var state))
        {
            _nominals[key] = state = new NominalBands(key, options);
        }

        var dev = ((r.Value.Value / key) - 1) * 1e6;
        var u = r.Value.ExpandedTransfer / key * 1e6;
        if (Math.Abs(dev) > options.StockTolerancePercent * 1e4)
        {
            var outside = FormattableString.Invariant($"{dev:+0;-0} ppm is outside the stock tolerance");
            return Record(r, key, null, outside, forcedLabel);
        }

        if (u > options.UncertaintyLimitPpm)
        {
            return Record(
                r,
                key,
                null,
                FormattableString.Invariant($"uncertainty {u:0} ppm is over the limit"),
                forcedLabel
            );
        }

        state.Samples.Add((r.PartNumber, dev, u));
        var band = Choose(state, dev, u);
        if (forcedLabel is not null && forcedLabel != (band?.Label ?? CupLabels.Reject))
        {
            band = Forced(state, forcedLabel, dev, u);
        }

        if (state.Follows && band is not null && !band.Fits(dev, u))
        {
            var (lo, hi) = Hulls(state)[band.Label];
            band = state.Cover(band.Label, Math.Min(lo, dev - u), Math.Max(hi, dev + u));
        }

        var reason = band is null
            ? FormattableString.Invariant($"{dev:+0;-0} ± {u:0} ppm fits no band")
            : FormattableString.Invariant($"band {band.Lo:+0;-0}..{band.Hi:+0;-0} ppm");
        return Record(r, key, band, reason, forcedLabel);
    }

    // Among the bands the part fits, one already holding parts (the one nearest to completing a set), else a planned
    // band of an empty cup, placed again first when the sample has grown.
    private NominalBands.Band? Choose(NominalBands state, double dev, double u)
    {
        bool Empty(string label) => _ledger.Count(state.Nominal, label) == 0;
        if (state.Follows && state.Stale)
        {
            state.Replan(Empty, Hulls(state));
        }

        // Following its parts, a cup may also take a part across its band's edge when its parts leave room: the band
        // then moves to hold it (by at most the part's own interval, 2U, the width over which a part can straddle an
        // edge; a wider reach was measured worse, docs/planning.md).
        var hulls = state.Follows ? Hulls(state) : null;
        bool Fits(NominalBands.Band b) =>
            b.Fits(dev, u) || (hulls is not null && state.CanHold(b, hulls[b.Label], dev, u, 2 * u));
        var holding = state
            .Bands.Where(b => !Empty(b.Label) && Fits(b))
            .MaxBy(b =>
                (_ledger.Count(state.Nominal, b.Label) % state.PartsPerSet, _ledger.Count(state.Nominal, b.Label))
            );
        if (holding is not null || state.Bands.Count(b => !Empty(b.Label)) >= options.CupCount)
        {
            return holding;
        }

        if (state.Stale)
        {
            state.Replan(Empty);
            Log.BandsPlanned(
                _logger,
                state.Nominal,
                state.Samples.Count,
                string.Join(
                    " ",
                    state
                        .Bands.OrderBy(b => b.Lo)
                        .Select(b => FormattableString.Invariant($"{b.Label}[{b.Lo:0},{b.Hi:0}]"))
                )
            );
        }

        return state.Bands.FirstOrDefault(b => Empty(b.Label) && b.Fits(dev, u));
    }

    // A restart replays the history: the recorded cup wins; a cup the replay has no band for gets one around the part.
    private NominalBands.Band? Forced(NominalBands state, string label, double dev, double u)
    {
        if (label == CupLabels.Reject)
        {
            return null;
        }

        var band = state.Bands.FirstOrDefault(b => b.Label == label);
        if (state.Follows && band is not null && _ledger.Count(state.Nominal, label) > 0 && !band.Fits(dev, u))
        {
            // A band that follows its parts moves to hold this one too.
            var (lo, hi) = Hulls(state)[label];
            return state.Cover(label, Math.Min(lo, dev - u), Math.Max(hi, dev + u));
        }

        return band is not null && (_ledger.Count(state.Nominal, label) > 0 || band.Fits(dev, u))
            ? band
            : state.OpenFor(label, dev, u);
    }

    // Lowest and highest edge (ppm) of the parts' uncertainty intervals in each cup of the nominal that holds parts.
    private Dictionary<string, (double Lo, double Hi)> Hulls(NominalBands state)
    {
        var hulls = new Dictionary<string, (double Lo, double Hi)>();
        foreach (var (part, dev, u) in state.Samples)
        {
            if (_ledger.LabelOf(part) is { } label && label != CupLabels.Reject)
            {
                hulls[label] = hulls.TryGetValue(label, out var h)
                    ? (Math.Min(h.Lo, dev - u), Math.Max(h.Hi, dev + u))
                    : (dev - u, dev + u);
            }
        }

        return hulls;
    }

    private CupDecision Record(CupRequest r, double key, NominalBands.Band? band, string reason, string? forcedLabel)
    {
        if (forcedLabel is not null)
        {
            reason = "restored from history";
            if (forcedLabel != (band?.Label ?? CupLabels.Reject))
            {
                throw new ArgumentException(
                    $"cup label '{forcedLabel}' of part {r.PartNumber} is not a cup of nominal {key}",
                    nameof(forcedLabel)
                );
            }
        }

        var label = band?.Label ?? CupLabels.Reject;
        var count = _ledger.Add(r, key, label);
        var k = _nominals.GetValueOrDefault(key)?.PartsPerSet ?? 1;
        return band is null
            ? new CupDecision(label, options.CupCount, true, reason, false)
            : new CupDecision(label, band.Index, false, reason, count % k == 0);
    }
}
