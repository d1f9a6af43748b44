using System.Diagnostics;
using System.Globalization;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;
using SortRig.Storage;
using SortRig.Storage.Contracts;

namespace SortRig.Bench.Lab;

/// <summary>
/// One bench of the `lab` benchmark, run as its own process: opens the log, its own session and batch, commits a few
/// warm-up parts, says "ready", waits for "go" on stdin, then commits parts (12 raw readings each, as a sort does)
/// one after another for the given seconds and prints "done count seconds p50ms p95ms".
/// </summary>
internal static class LabWorker
{
    public static async Task<int> RunAsync(string database, string session, double seconds, CancellationToken ct)
    {
        await using var log = await PrecisionLogFactory.OpenAsync(database, null, ct).ConfigureAwait(false);
        var state = await log.OpenOrResumeSessionAsync(new SessionRequest(session, "bench"), ct).ConfigureAwait(false);
        var setup = new BatchSetup(10_000, 10_000, 1_000, 100_000, 1, true, "sim-dmm-6", "SORTRIG,SIM-DMM-6,0001,1.0");
        var batch = await log.StartBatchAsync(state.Session.Id, setup, ct).ConfigureAwait(false);
        var random = new Random(session.GetHashCode(StringComparison.Ordinal));
        var at = new DateTimeOffset(2026, 3, 2, 8, 0, 0, TimeSpan.Zero);
        int n = 0;
        PartCommit Next()
        {
            n++;
            double value = 10_000 * (1 + ((random.NextDouble() - 0.5) * 0.02)); // invented 1 % stock
            var raw = Enumerable
                .Range(0, 12)
                .Select(k =>
                    Reading.Finite(value + ((k - 6) * 0.0005), at.AddSeconds(n * 3).AddMilliseconds(k * 40), 100_000)
                )
                .ToArray();
            return new PartCommit(
                Guid.NewGuid(),
                state.Session.Id,
                batch.Id,
                new MeasuredValue(value, value * 12e-6, value * 1.5e-6),
                100_000,
                1,
                23.1,
                at.AddSeconds(n * 3),
                "C" + (n % 12),
                null,
                raw
            );
        }

        for (int i = 0; i < 10; i++)
        {
            await log.CommitPartAsync(Next(), ct).ConfigureAwait(false);
        }

        Console.WriteLine("ready");
        if (await Console.In.ReadLineAsync(ct).ConfigureAwait(false) != "go")
        {
            return 1;
        }

        var latencies = new List<double>();
        var total = Stopwatch.StartNew();
        while (total.Elapsed.TotalSeconds < seconds)
        {
            var one = Stopwatch.StartNew();
            await log.CommitPartAsync(Next(), ct).ConfigureAwait(false);
            latencies.Add(one.Elapsed.TotalMilliseconds);
        }

        var elapsed = total.Elapsed.TotalSeconds;
        latencies.Sort();
        Console.WriteLine(
            string.Create(
                CultureInfo.InvariantCulture,
                $"done {latencies.Count} {elapsed:F3} {latencies[latencies.Count / 2]:F2} "
                    + $"{latencies[(int)(latencies.Count * 0.95)]:F2}"
            )
        );
        return 0;
    }
}
