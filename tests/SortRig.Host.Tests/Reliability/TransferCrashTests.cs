using System.Globalization;
using SortRig.Engine.Simulation;
using SortRig.Engine.Sorting;
using SortRig.Host.Tests.Reliability.Support;
using SortRig.Simulator;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Reliability;

/// <summary>
/// SIGKILL during a range transfer (an R-2R ladder's 2R batch after its R batch): once with the bridging part
/// read on both ranges but the correction not yet recorded, once with it recorded but not yet announced.
/// Each restart carries on: a transfer not recorded is measured again, a recorded one is applied without
/// asking, and the session ends with one transfer, every part once, and a sound database.
/// </summary>
[Collection(ReliabilityCollection.Name)]
public sealed class TransferCrashTests(ITestOutputHelper output) : IDisposable
{
    private const int R = 3; // 10 kOhm parts 1..3, then 20 kOhm parts 4..6
    private const int Total = 6;
    private const int Seed = 2026;
    private static readonly TimeSpan s_limit = TimeSpan.FromMinutes(2);
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-transfer-crash-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task KilledAroundTheTransferRecord_RestartsMeasureOrApplyIt_OneTransferNothingLost()
    {
        var db = Path.Combine(_dir, "ladder.db");
        var first = await RunAsync(db, 10_000, R, crashAt: null);
        Assert.Equal(0, first.ExitCode);

        var beforeRecord = await RunAsync(db, 20_000, Total, crashAt: "bridge:1");
        Assert.True(beforeRecord.DiedOfSigkill, Tail(beforeRecord));
        Assert.Contains(beforeRecord.Lines, l => l.Contains("as a bridging part", StringComparison.Ordinal));
        Assert.DoesNotContain(beforeRecord.Lines, l => l.Contains("range transfer recorded", StringComparison.Ordinal));

        // Nothing was recorded: the restart asks for the bridging part again, records, and is killed before saying so.
        var afterRecord = await RunAsync(db, 20_000, Total, crashAt: "bridged:1");
        Assert.True(afterRecord.DiedOfSigkill, Tail(afterRecord));
        Assert.Contains(afterRecord.Lines, l => l.Contains("as a bridging part", StringComparison.Ordinal));
        Assert.DoesNotContain(afterRecord.Lines, l => l.Contains("range transfer recorded", StringComparison.Ordinal));

        // Recorded before the kill: applied without asking, and the batch is sorted to its end.
        var last = await RunAsync(db, 20_000, Total, crashAt: null);
        Assert.Equal(0, last.ExitCode);
        Assert.Contains(last.Lines, l =>
            l.Contains("range transfer already recorded for this batch", StringComparison.Ordinal)
        );
        Assert.DoesNotContain(last.Lines, l => l.Contains("bridging part", StringComparison.Ordinal));

        DatabaseChecks.AssertIntegrity(db);
        await using var log = await PrecisionLogFactory.OpenAsync(db, null, default);
        var session = Assert.Single(await log.ListSessionsAsync(default), s => s.Name == "ladder");
        var parts = await log.GetPartsAsync(session.Id, default);
        Assert.Equal(Enumerable.Range(1, Total), parts.Select(p => p.Number));
        Assert.All(parts, p => Assert.Equal(PartState.Announced, p.State));
        var batches = await log.GetBatchesAsync(session.Id, default);
        Assert.Equal(2, batches.Count); // the 20 k batch resumed each time, never started again
        var transfer = Assert.Single(batches, b => b.RangeTransfer is not null).RangeTransfer!;

        // Simulator truth (same seed): the factor that puts the 100 k range on the 10 k range's scale is
        // (1 + g_10k)/(1 + g_100k); the recorded one agrees within k = 2 (JCGM 100:2008 sec. 6.2.1).
        await using var bench = new SimulatedBench(DemoBench.For(Options(20_000, Total), Total));
        var trueCorrectionPpm = RangeTransferSession.TrueCorrectionPpm(bench, transfer.FromRange, transfer.ToRange);
        output.WriteLine(
            $"recorded {transfer.CorrectionPpm:F1} ppm (u {transfer.StandardUncertaintyPpm:F1}), true "
                + $"{trueCorrectionPpm:F1} ppm"
        );
        Assert.InRange(
            transfer.CorrectionPpm - trueCorrectionPpm,
            -2 * transfer.StandardUncertaintyPpm,
            2 * transfer.StandardUncertaintyPpm
        );
    }

    private Task<HostRun> RunAsync(string db, double nominal, int parts, string? crashAt) =>
        HostProcess.RunAsync(_dir, Args(db, nominal, parts), crashAt, strace: null, killAfter: null, s_limit);

    private static string[] Args(string db, double nominal, int parts) =>
        [
            "sort",
            "--plain",
            "--no-speech",
            "--speed",
            "100",
            "--nplc",
            "10",
            "--reopen",
            "--bridge",
            "always",
            "--nominal",
            nominal.ToString(CultureInfo.InvariantCulture),
            "--parts",
            parts.ToString(CultureInfo.InvariantCulture),
            "--db",
            db,
            "--session",
            "ladder",
            "--seed",
            Seed.ToString(CultureInfo.InvariantCulture),
        ];

    private static SortOptions Options(double nominal, int parts) =>
        new()
        {
            Nominal = nominal,
            Parts = parts,
            Seed = Seed,
            Nplc = 10,
        };

    private static string Tail(HostRun run) => $"exit {run.ExitCode}\n{string.Join('\n', run.Lines.TakeLast(15))}";
}
