using SortRig.Engine.Sorting;
using SortRig.Measurement.Settling;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Sorting;

/// <summary>
/// A session stopped (Ctrl+C) and resumed on the same reel: the predictive settle rule goes on from what the first
/// run's parts taught it (docs/measurement.md, the reel prior) instead of learning the reel again. The product's own
/// rule, checked on what the log keeps with the batch: the prior counts every part the sort's settle rule accepted
/// in the batch, over both runs. Virtual clock, real TCP socket and SQLite file.
/// </summary>
public sealed class ResumeReelPriorTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-resume-prior-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Resume_TheSameReel_GoesOnFromWhatTheFirstRunsPartsTaught()
    {
        const int parts = 12,
            stopAt = 5;
        var options = new SortOptions
        {
            Database = Path.Combine(_dir, "resume-prior.db"),
            Session = "resume-prior",
            Parts = parts,
            Seed = 5150,
            Speech = false,
            Live = false,
        };
        var ears = new ListeningAnnouncer();
        var first = new VirtualSort(ears);
        using var stop = new CancellationTokenSource();
        ears.OnLine = line =>
        {
            if (line.StartsWith($"part {stopAt}: cup", StringComparison.Ordinal))
            {
                stop.Cancel();
            }
        };
        await Assert.ThrowsAnyAsync<OperationCanceledException>(() => first.RunAsync(options, ct: stop.Token));
        var (sessionId, afterFirst, acceptedFirst) = await ReadAsync(options.Database);

        var outcome = await new VirtualSort(new ListeningAnnouncer()).RunAsync(options);
        var (sameSession, afterBoth, acceptedBoth) = await ReadAsync(options.Database);

        Assert.Equal(sessionId, sameSession);
        Assert.Equal(parts, outcome.PartsRecorded);
        Assert.Equal(acceptedFirst, afterFirst.Seen);
        Assert.True(acceptedFirst >= stopAt - 1, $"{acceptedFirst} parts accepted before the stop");
        // Every accepted part of both runs is counted: the second run went on from the first run's prior (a prior
        // learned afresh would count only the second run's parts).
        Assert.Equal(acceptedBoth, afterBoth.Seen);
        Assert.True(acceptedBoth > acceptedFirst);
        Assert.True(afterBoth.Count >= afterFirst.Count);
    }

    private static async Task<(long Session, ReelPrior Prior, int Accepted)> ReadAsync(string database)
    {
        await using var log = await PrecisionLogFactory.OpenAsync(database, null, default);
        var session = Assert.Single(await log.ListSessionsAsync(default)).Id;
        var batch = Assert.Single(await log.GetBatchesAsync(session, default));
        var accepted = (await log.GetPartsAsync(session, default)).Count(p => p.AcceptedBy is not null);
        return (session, Assert.IsType<ReelPrior>(batch.ReelPrior), accepted);
    }
}
