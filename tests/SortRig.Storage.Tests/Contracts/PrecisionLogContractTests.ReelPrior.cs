using SortRig.Measurement.Settling;
using SortRig.Storage.Contracts;
using SortRig.Storage.Tests.Lab;

namespace SortRig.Storage.Tests.Contracts;

/// <summary>
/// What the settle rule learned of a batch's reel (schema version 7): stored with the batch in the transaction of the
/// part that carried it, read back bit-exact after a reopen (the empty prior's infinite range included), left as it
/// was by a part without one and by a retried commit. The prior's figures are invented for the test.
/// </summary>
public abstract partial class PrecisionLogContractTests
{
    /// <summary>Twenty resolved bodies of 3.3-4.6 s among 27 parts (invented).</summary>
    private static ReelPrior Learned => new(20, 3.312_5, 4.618_75, 0.193_1, 27, 27.771_234_567, 38.661_098_765_4);

    [SkippableFact]
    public async Task CommitPart_WithReelPrior_StoredWithTheBatch_ReadBackOnResume()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var id = session.Session.Id;
        Assert.Null(batch.ReelPrior);

        await log.CommitPartAsync(Bench.Part(id, batch, 10_000.1) with { ReelPrior = ReelPrior.Empty }, default);
        Assert.Equal(ReelPrior.Empty, Assert.Single(await log.GetBatchesAsync(id, default)).ReelPrior);

        var key = Guid.NewGuid();
        await log.CommitPartAsync(
            Bench.Part(id, batch, 10_000.2, key: key, index: 1) with
            {
                ReelPrior = Learned,
            },
            default
        );
        // A part without a prior (a part measured on its own) and a retry of the last commit leave the batch's.
        await log.CommitPartAsync(Bench.Part(id, batch, 10_000.3, index: 2), default);
        var retried = await log.CommitPartAsync(
            Bench.Part(id, batch, 10_000.2, key: key, index: 1) with
            {
                ReelPrior = ReelPrior.Empty,
            },
            default
        );
        await log.DisposeAsync(); // the host stops here

        var reopened = await CreateLogAsync();
        var state = await reopened.OpenOrResumeSessionAsync(new SessionRequest(session.Session.Name), default);

        Assert.True(state.Resumed);
        Assert.Equal(2, retried.Number);
        // System.Text.Json writes each double in the shortest form that parses back to it: bit-exact.
        Assert.Equal(Learned, state.CurrentBatch!.ReelPrior);
        Assert.Equal(Learned.BodyRange, state.CurrentBatch.ReelPrior!.BodyRange);
        Assert.Equal(4, state.NextPartNumber);
    }

    [SkippableFact]
    public async Task CommitPart_ReelPriorWithNegativeCount_RefusedNamingTheField_NothingStored()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);

        var refused = await Assert.ThrowsAsync<ArgumentOutOfRangeException>(() =>
            log.CommitPartAsync(
                Bench.Part(session.Session.Id, batch, 10_000.1) with
                {
                    ReelPrior = Learned with { Seen = -1 },
                },
                default
            )
        );

        Assert.Contains("ReelPrior.Seen", refused.Message, StringComparison.Ordinal);
        Assert.Empty(await log.GetPartsAsync(session.Session.Id, default));
        Assert.Null(Assert.Single(await log.GetBatchesAsync(session.Session.Id, default)).ReelPrior);
    }

    [SkippableTheory]
    [InlineData("not a prior")]
    [InlineData("null")]
    [InlineData("{\"count\": 20, \"seen\": 27}")]
    [InlineData(
        "{\"count\": 20, \"lowest\": 3.3, \"highest\": 4.6, \"largest_error\": 0.19, \"seen\": -4, \"sum_log\": 27.7, "
            + "\"sum_squares_log\": 38.6}"
    )]
    public async Task ResumeSession_ReelPriorUnreadable_OpensWithoutIt_PartsKept(string stored)
    {
        // Common practice, no source: what the reel taught is derived from the parts; text that does not read as a
        // prior (a hand edit: not JSON, JSON null, figures missing, a count below zero) costs the learning, not the
        // batch: the session resumes, its parts are all there.
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var id = session.Session.Id;
        await log.CommitPartAsync(Bench.Part(id, batch, 10_000.1) with { ReelPrior = Learned }, default);
        await log.CommitPartAsync(Bench.Part(id, batch, 10_000.2, index: 1) with { ReelPrior = Learned }, default);
        await PlainScalarAsync($"UPDATE batches SET reel_prior = '{stored}' WHERE id = {batch.Id}");
        await log.DisposeAsync();

        var logs = new CapturingLoggerFactory();
        var reopened = await CreateLogAsync(new PrecisionLogOptions { TimeProvider = Clock, LoggerFactory = logs });
        var state = await reopened.OpenOrResumeSessionAsync(new SessionRequest(session.Session.Name), default);

        Assert.True(state.Resumed);
        Assert.Null(state.CurrentBatch!.ReelPrior);
        Assert.Contains(logs.Lines, l =>
            l.StartsWith("Warning", StringComparison.Ordinal)
            && l.Contains($"Batch {batch.Id}:", StringComparison.Ordinal)
        );
        Assert.Equal(3, state.NextPartNumber);
        Assert.Equal(2, (await reopened.GetPartsAsync(id, default)).Count);
    }
}
