using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

public abstract partial class PrecisionLogContractTests
{
    private const int DriftChannels = 4;
    private const int DriftSteps = 25_000; // 4 x 25 000 = 100 000 samples

    /// <summary>Invented overnight drift: each channel creeps up 0.1 mOhm per step; temperature every second step
    /// only.</summary>
    private static StoredDriftSample DriftPoint(long runId, int step, int channel) =>
        new(
            runId,
            channel,
            Bench.T0.AddSeconds(10L * step),
            10_000 + (channel * 0.5) + (step * 1e-4),
            step % 2 == 0 ? 22.0 + (step % 100) * 0.01 : null
        );

    [SkippableFact]
    public async Task Drift_Append100000SamplesInBatches_StreamsThemBackInOrder()
    {
        var log = await CreateLogAsync();
        var parts = await StockLibraryAsync(log, 12);
        var channels = new[]
        {
            new DriftChannel("scan-1", parts[0].Id),
            new DriftChannel("scan-2"),
            new DriftChannel("scan-3"),
            new DriftChannel("ref"),
        };
        var run = await log.StartDriftRunAsync(
            new DriftRunRequest("overnight-0302", channels, TimeSpan.FromSeconds(10), "lab at 22 C"),
            CancellationToken.None
        );

        int inserted = 0;
        var batch = new List<StoredDriftSample>(1000);
        for (int step = 0; step < DriftSteps; step++)
        {
            for (int ch = 0; ch < DriftChannels; ch++)
            {
                batch.Add(DriftPoint(run.Id, step, ch));
            }

            if (batch.Count == 1000)
            {
                inserted += await log.AppendDriftSamplesAsync(batch, CancellationToken.None);
                batch.Clear();
            }
        }

        var again = await log.AppendDriftSamplesAsync(
            [DriftPoint(run.Id, 0, 0), DriftPoint(run.Id, 7, 3)],
            CancellationToken.None
        );
        await log.MarkGapAsync(
            new DriftGap(run.Id, Bench.T0.AddHours(2), Bench.T0.AddHours(2.5), "meter lost connection"),
            CancellationToken.None
        );

        Assert.Equal(100_000, inserted);
        Assert.Equal(0, again);
        Assert.Equal(
            new DriftRun(run.Id, "overnight-0302", Bench.T0, TimeSpan.FromSeconds(10), run.Channels, "lab at 22 C"),
            run
        );
        Assert.Equal(channels, (await log.GetDriftRunAsync(run.Id, CancellationToken.None))!.Channels);
        int count = 0;
        await foreach (var sample in log.ReadDriftSamplesAsync(run.Id, CancellationToken.None))
        {
            Assert.Equal(DriftPoint(run.Id, count / DriftChannels, count % DriftChannels), sample);
            count++;
        }

        Assert.Equal(100_000, count);
        Assert.Equal(
            [new DriftGap(run.Id, Bench.T0.AddHours(2), Bench.T0.AddHours(2.5), "meter lost connection")],
            await log.GetDriftGapsAsync(run.Id, CancellationToken.None)
        );
    }

    [SkippableFact]
    public async Task Drift_SampleOnUnknownChannel_RejectsTheWholeBatch()
    {
        var log = await CreateLogAsync();
        var run = await log.StartDriftRunAsync(
            new DriftRunRequest("short", [new DriftChannel("scan-1")], TimeSpan.FromSeconds(1)),
            CancellationToken.None
        );

        var error = await Assert.ThrowsAsync<StorageException>(() =>
            log.AppendDriftSamplesAsync([DriftPoint(run.Id, 0, 0), DriftPoint(run.Id, 0, 5)], CancellationToken.None)
        );

        Assert.Equal(StorageFault.Constraint, error.Fault);
        var stored = new List<StoredDriftSample>();
        await foreach (var s in log.ReadDriftSamplesAsync(run.Id, CancellationToken.None))
        {
            stored.Add(s);
        }

        Assert.Empty(stored);
    }
}
