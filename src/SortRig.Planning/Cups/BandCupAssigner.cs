using System.Globalization;

namespace SortRig.Planning.Cups;

/// <summary>
/// Fixed bands: K bands of deviation from nominal, each as wide as the match tolerance, centred on the nominal
/// (cup i covers [−K w/2 + i w, −K w/2 + (i+1) w) ppm); anything else goes to the reject cup "R".
/// </summary>
public sealed class BandCupAssigner(BandCupOptions options) : ICupAssigner
{
    private readonly CupLedger _ledger = new();

    /// <inheritdoc />
    public IReadOnlyList<CupCount> Counts =>
        Enumerable
            .Range(0, options.CupCount + 1)
            .Select(i =>
            {
                var reject = i == options.CupCount;
                var label = reject ? CupLabels.Reject : CupLabels.For(i);
                var n = _ledger.Count(options.Nominal, label);
                return new CupCount(
                    options.Nominal,
                    label,
                    i,
                    reject,
                    n,
                    reject ? double.NaN : Low(i),
                    reject ? double.NaN : Low(i + 1),
                    reject ? 0 : n / options.PartsPerSet
                );
            })
            .Where(c => c.Count > 0 || c.IsReject)
            .ToList();

    /// <inheritdoc />
    public CupDecision Assign(CupRequest request)
    {
        _ledger.EnsureNew(request.PartNumber);
        var (index, reason) = Decide(request);
        var label = index < 0 ? CupLabels.Reject : CupLabels.For(index);
        var count = _ledger.Add(request, options.Nominal, label);
        return index < 0
            ? new CupDecision(label, options.CupCount, true, reason, false)
            : new CupDecision(label, index, false, reason, count % options.PartsPerSet == 0);
    }

    /// <inheritdoc />
    public void Restore(IReadOnlyList<(CupRequest Part, string CupLabel)> history)
    {
        _ledger.Clear();
        foreach (var (part, label) in history)
        {
            var i = CupLabels.IndexOf(label);
            if (label != CupLabels.Reject && (i < 0 || i >= options.CupCount))
            {
                throw new ArgumentException(
                    $"cup label '{label}' of part {part.PartNumber} is not one of this assigner's cups",
                    nameof(history)
                );
            }

            _ledger.Add(part, options.Nominal, label);
        }
    }

    /// <inheritdoc />
    public void Undo(long partNumber) => _ledger.Remove(partNumber);

    private double Low(int i) => (-options.CupCount * options.MatchTolerancePpm / 2) + (i * options.MatchTolerancePpm);

    private (int Index, string Reason) Decide(CupRequest r)
    {
        if (Math.Abs(r.Nominal - options.Nominal) > options.Nominal * 1e-4)
        {
            return (
                -1,
                $"nominal {r.Nominal.ToString(CultureInfo.InvariantCulture)} ohm is not this reel's "
                    + $"{options.Nominal.ToString(CultureInfo.InvariantCulture)} ohm"
            );
        }

        var dev = ((r.Value.Value / options.Nominal) - 1) * 1e6;
        var u = r.Value.ExpandedTransfer / options.Nominal * 1e6;
        if (Math.Abs(dev) > options.StockTolerancePercent * 1e4)
        {
            return (
                -1,
                FormattableString.Invariant(
                    $"{dev:+0;-0} ppm is outside the stock tolerance ±{options.StockTolerancePercent} %"
                )
            );
        }

        if (u > options.UncertaintyLimitPpm)
        {
            return (
                -1,
                FormattableString.Invariant(
                    $"uncertainty {u:0} ppm is over the {options.UncertaintyLimitPpm:0} ppm limit"
                )
            );
        }

        var i = (int)Math.Floor((dev - Low(0)) / options.MatchTolerancePpm);
        return i >= 0 && i < options.CupCount
            ? (i, FormattableString.Invariant($"band {Low(i):+0;-0}..{Low(i + 1):+0;-0} ppm"))
            : (-1, FormattableString.Invariant($"{dev:+0;-0} ppm is outside the {options.CupCount} bands"));
    }
}
