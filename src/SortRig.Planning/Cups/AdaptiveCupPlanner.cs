using System.Globalization;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;

namespace SortRig.Planning.Cups;

/// <summary>
/// Online cup planner that learns each nominal's spread. While the first <see cref="AdaptiveCupOptions.LearnCount"/>
/// parts of a nominal arrive, parts go to the centred bands of <see cref="BandCupAssigner"/>; then every cup still
/// empty gets a new band where the learned distribution is densest (<see cref="BandPlacer"/>), never overlapping a
/// band that already holds parts; at twice, four times ... the learn
/// count, the bands of cups still empty are placed again with the larger sample. No band edge ever moves under parts
/// already sorted. Each nominal has its own K cups (one reel at a time); everything else goes to "R".
/// </summary>
public sealed class AdaptiveCupPlanner(AdaptiveCupOptions options, ILogger<AdaptiveCupPlanner>? logger = null) : ICupAssigner
{
    private readonly CupLedger _ledger = new();
    private readonly Dictionary<double, NominalBands> _nominals = [];
    private readonly ILogger _logger = (ILogger?)logger ?? NullLogger.Instance;

    /// <inheritdoc />
    public IReadOnlyList<CupCount> Counts =>
        _nominals.Values.SelectMany(n => n.Bands.Select(b =>
            {
                var c = _ledger.Count(n.Nominal, b.Label);
                return new CupCount(n.Nominal, b.Label, b.Index, false, c, b.Lo, b.Hi, c / n.PartsPerSet);
            }))
            .Concat(_ledger.NonEmpty.Where(e => e.Key.Label == CupLabels.Reject)
                .Select(e => new CupCount(e.Key.Nominal, CupLabels.Reject, options.CupCount, true, e.Count, double.NaN, double.NaN, 0)))
            .ToList();

    /// <summary>The bands of a nominal so far (label, low and high edge in ppm); empty before its first part.</summary>
    public IReadOnlyList<(string Label, double LowPpm, double HighPpm)> Bands(double nominal) =>
        _nominals.TryGetValue(nominal, out var n) ? n.Bands.OrderBy(b => b.Lo).Select(b => (b.Label, b.Lo, b.Hi)).ToList() : [];

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
            return Record(r, 0, null, $"nominal {r.Nominal.ToString(CultureInfo.InvariantCulture)} ohm is not in the plan", forcedLabel);
        }

        if (!_nominals.TryGetValue(key, out var state))
        {
            _nominals[key] = state = new NominalBands(key, options);
        }

        var dev = ((r.Value.Value / key) - 1) * 1e6;
        var u = r.Value.ExpandedTransfer / key * 1e6;
        if (Math.Abs(dev) > options.StockTolerancePercent * 1e4)
        {
            return Record(r, key, null, FormattableString.Invariant($"{dev:+0;-0} ppm is outside the stock tolerance"), forcedLabel);
        }

        if (u > options.UncertaintyLimitPpm)
        {
            return Record(r, key, null, FormattableString.Invariant($"uncertainty {u:0} ppm is over the limit"), forcedLabel);
        }

        var band = state.Find(dev) ?? (state.Learned ? null : state.TryOpenGridBand(dev));
        state.Samples.Add((r.PartNumber, dev));
        if (state.DueToLearn)
        {
            // The part just decided is not in the ledger yet: keep its band.
            state.Learn(label => label != band?.Label && _ledger.Count(key, label) == 0);
            Log.BandsLearned(_logger, key, state.Samples.Count, string.Join(" ", state.Bands.OrderBy(b => b.Lo).Select(b => FormattableString.Invariant($"{b.Label}[{b.Lo:0},{b.Hi:0})"))));
        }

        var reason = band is null
            ? FormattableString.Invariant($"{dev:+0;-0} ppm is in no band{(state.Learned ? "" : " open while learning")}")
            : FormattableString.Invariant($"band {band.Lo:+0;-0}..{band.Hi:+0;-0} ppm");
        return Record(r, key, band, reason, forcedLabel);
    }

    private CupDecision Record(CupRequest r, double key, NominalBands.Band? band, string reason, string? forcedLabel)
    {
        if (forcedLabel is not null && forcedLabel != (band?.Label ?? CupLabels.Reject))
        {
            band = forcedLabel == CupLabels.Reject ? null
                : _nominals.GetValueOrDefault(key)?.Bands.FirstOrDefault(b => b.Label == forcedLabel)
                  ?? throw new ArgumentException($"cup label '{forcedLabel}' of part {r.PartNumber} is not a band of nominal {key}", nameof(forcedLabel));
            reason = "restored from history";
        }

        var label = band?.Label ?? CupLabels.Reject;
        var count = _ledger.Add(r, key, label);
        var k = _nominals.GetValueOrDefault(key)?.PartsPerSet ?? 1;
        return band is null
            ? new CupDecision(label, options.CupCount, true, reason, false)
            : new CupDecision(label, band.Index, false, reason, count % k == 0);
    }
}
