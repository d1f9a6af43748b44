using SortRig.Measurement.Uncertainty;
using SortRig.Storage.Contracts;

namespace SortRig.Host.Tests.Library;

/// <summary>One part to seed: deviation from nominal, transfer uncertainty (standard, ppm) and where it went.</summary>
public sealed record SeedPart(
    double Ppm,
    double UTransferPpm,
    string? Cup = null,
    string? Slot = null,
    double Nominal = 10_000
);

/// <summary>
/// Seeds a log through <see cref="IPrecisionLog"/> as the sorting loop does: a session, a batch per nominal, committed
/// parts. Invented demo scenario (a small instrument maker's 10 kOhm reel); values are chosen by each test.
/// </summary>
public static class Seed
{
    public static readonly DateTimeOffset At = new(2026, 3, 2, 9, 30, 0, TimeSpan.Zero);

    /// <summary>Value of a part from its deviation: nominal (1 + ppm 1e-6).</summary>
    public static double Value(SeedPart p) => p.Nominal * (1 + (p.Ppm * 1e-6));

    public static async Task<IReadOnlyList<PartRecord>> SessionAsync(
        IPrecisionLog log,
        string name,
        IReadOnlyList<SeedPart> parts
    )
    {
        var session = await log.OpenOrResumeSessionAsync(new SessionRequest(name, "mira"), CancellationToken.None);
        var batches = new Dictionary<double, BatchInfo>();
        var stored = new List<PartRecord>();
        for (var i = 0; i < parts.Count; i++)
        {
            var p = parts[i];
            if (!batches.TryGetValue(p.Nominal, out var batch))
            {
                batch = await log.StartBatchAsync(
                    session.Session.Id,
                    new BatchSetup(
                        p.Nominal,
                        10_000,
                        1_000,
                        p.Nominal * 10,
                        10,
                        true,
                        "sim-dmm-6",
                        "SORTRIG,SIM-DMM-6,0001,1.0"
                    ),
                    CancellationToken.None
                );
                batches[p.Nominal] = batch;
            }

            var value = Value(p);
            var measured = new MeasuredValue(value, value * 25e-6, value * p.UTransferPpm * 1e-6);
            stored.Add(
                await log.CommitPartAsync(
                    new PartCommit(
                        Guid.NewGuid(),
                        session.Session.Id,
                        batch.Id,
                        measured,
                        batch.Setup.Range,
                        10,
                        23.1,
                        At.AddSeconds(20 * i),
                        p.Cup,
                        p.Slot,
                        []
                    ),
                    CancellationToken.None
                )
            );
        }

        return stored;
    }

    /// <summary>Opens the store, seeds one session, closes.</summary>
    public static async Task<IReadOnlyList<PartRecord>> SessionAsync(
        TestStore store,
        string name,
        IReadOnlyList<SeedPart> parts
    )
    {
        await using var log = await store.OpenAsync();
        return await SessionAsync(log, name, parts);
    }
}
