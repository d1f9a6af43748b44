using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

/// <summary>
/// Invented demo scenario: a small instrument maker sorting 1 % 10 kOhm and 20 kOhm parts for R-2R DAC ladders,
/// matched to 0.05 %, on a simulated 6.5-digit meter. Values are made up for the tests, not reference data.
/// </summary>
internal static class Bench
{
    public static readonly DateTimeOffset T0 = new(2026, 3, 2, 8, 0, 0, TimeSpan.Zero);

    public static BatchSetup TenK =>
        new(
            Nominal: 10_000,
            StockTolerancePpm: 10_000,
            MatchTolerancePpm: 500,
            Range: 100_000,
            Nplc: 10,
            FourWire: true,
            MeterFamily: "sim-dmm-6",
            MeterIdentity: "SORTRIG,SIM-DMM-6,0001,1.0",
            RecipeName: "r2r-ladder-10k"
        );

    public static BatchSetup TwentyK => TenK with { Nominal = 20_000, RecipeName = null };

    public static async Task<(SessionState Session, BatchInfo Batch)> StartAsync(
        IPrecisionLog log,
        string name = "r2r-ladder-0412",
        BatchSetup? setup = null
    )
    {
        var session = await log.OpenOrResumeSessionAsync(new SessionRequest(name, "mira"), CancellationToken.None);
        var batch = await log.StartBatchAsync(session.Session.Id, setup ?? TenK, CancellationToken.None);
        return (session, batch);
    }

    public static PartCommit Part(
        long sessionId,
        BatchInfo batch,
        double value,
        string? cup = "A",
        Guid? key = null,
        int readings = 3,
        int index = 0
    )
    {
        var at = T0.AddSeconds(30 * index);
        var raw = Enumerable
            .Range(0, readings)
            .Select(i =>
                Reading.Finite(
                    value + (i - (readings / 2)) * 0.002,
                    at.AddMilliseconds(-200 * (readings - i)),
                    batch.Setup.Range
                )
            )
            .ToArray();
        return new PartCommit(
            key ?? Guid.NewGuid(),
            sessionId,
            batch.Id,
            new MeasuredValue(value, value * 12e-6, value * 1.5e-6),
            batch.Setup.Range,
            batch.Setup.Nplc,
            22.8,
            at,
            cup,
            null,
            raw
        );
    }

    public static Task<PartRecord> CommitAsync(
        IPrecisionLog log,
        long sessionId,
        BatchInfo batch,
        double value,
        string? cup = "A",
        int index = 0
    ) => log.CommitPartAsync(Part(sessionId, batch, value, cup, index: index), CancellationToken.None);

    /// <summary>Value of a 10 kOhm part deviating by <paramref name="ppm"/> from nominal.</summary>
    public static double TenKAt(double ppm) => 10_000 * (1 + ppm * 1e-6);
}
