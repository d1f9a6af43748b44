using SortRig.Engine.Announcing;
using SortRig.Engine.Simulation;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Settling;
using SortRig.Simulator;

namespace SortRig.Tests.Support;

/// <summary>
/// Runs one sort verb session in-process on the embedded simulator (real TCP socket, real SQLite file,
/// virtual clock, <see cref="VirtualSort"/>) for the range-transfer tests: an R-2R ladder's R (10 kOhm) then
/// 2R (20 kOhm).
/// </summary>
internal sealed class RangeTransferSession(string database, double gainErrorPpm = DemoBench.RangeGainErrorPpm)
{
    // the demo seed: at the demo's 20 ppm bound its 10 k and 100 k ranges differ by about 32 ppm of gain
    public const int Seed = 2026;

    public SortOptions Options(double nominal, int totalParts, BridgeMode bridge, double match = 0.001) =>
        new()
        {
            Database = database,
            Session = "ladder",
            Nominal = nominal,
            MatchTolerance = match,
            Nplc = 10,
            Parts = totalParts,
            Seed = Seed,
            Bridge = bridge,
            Speech = false,
            Live = false,
            // The range-transfer checks read each stored value back as its window mean times the correction: an
            // identity of the averaging rule, so these sessions pin it (the sort's default is the predictive rule).
            Settle = SettleRule.Averaging,
        };

    /// <summary>
    /// Runs to the end, or until an announcement matches <paramref name="stopWhen"/>: the run is then stopped as
    /// with Ctrl+C (the session stays open and resumes by name).
    /// </summary>
    public async Task<Run> RunAsync(SortOptions options, Func<Announcement, bool>? stopWhen = null)
    {
        using var stop = new CancellationTokenSource();
        var heard = new StringWriter();
        var sort = new VirtualSort(new StoppingAnnouncer(new PlainTextAnnouncer(heard), stopWhen, stop));
        SortOutcome? outcome = null;
        try
        {
            outcome = await sort.RunAsync(options, b => b with { RangeGainErrorPpm = gainErrorPpm }, ct: stop.Token);
        }
        catch (OperationCanceledException) when (stopWhen is not null && stop.IsCancellationRequested)
        {
            // Stopped on purpose right after the announcement.
        }
        catch (TimeoutException e)
        {
            var last = string.Join('\n', heard.ToString().Split('\n').TakeLast(12));
            throw new TimeoutException(e.Message + "; last heard:\n" + last, e);
        }

        return new Run(outcome, sort.Bench, heard.ToString());
    }

    /// <summary>
    /// The correction that truly puts values read on <paramref name="fromRange"/> onto <paramref name="toRange"/>'s
    /// scale, ppm, from the simulator's truth: a reading on range r is (1 + g_r) × the true value, so F = (1 + g_to)/(1
    /// + g_from).
    /// </summary>
    public static double TrueCorrectionPpm(SimulatedBench bench, double fromRange, double toRange) =>
        (((1 + (bench.GainErrorPpm(toRange) * 1e-6)) / (1 + (bench.GainErrorPpm(fromRange) * 1e-6))) - 1) * 1e6;

    public sealed record Run(SortOutcome? Outcome, SimulatedBench Bench, string Heard);

    /// <summary>Stops the run once part <paramref name="number"/> has been given its cup.</summary>
    public static Func<Announcement, bool> AfterPart(int number) =>
        a => a.PartNumber == number && a.Kind is AnnouncementKind.Cup or AnnouncementKind.Reject;

    /// <summary>Stops the run once an operator note contains <paramref name="text"/>.</summary>
    public static Func<Announcement, bool> AfterNote(string text) =>
        a => a.Kind == AnnouncementKind.Info && a.Text.Contains(text, StringComparison.Ordinal);

    private sealed class StoppingAnnouncer(
        IAnnouncer inner,
        Func<Announcement, bool>? stopWhen,
        CancellationTokenSource stop
    ) : IAnnouncer
    {
        public async ValueTask AnnounceAsync(Announcement announcement, CancellationToken cancellationToken)
        {
            await inner.AnnounceAsync(announcement, cancellationToken);
            if (stopWhen is not null && stopWhen(announcement))
            {
                await stop.CancelAsync();
            }
        }
    }
}
