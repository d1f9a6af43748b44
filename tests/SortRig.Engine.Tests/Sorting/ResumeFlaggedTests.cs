using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Sorting;

/// <summary>
/// A session stopped while a check out of control waits for the operator (the meter's gain had stepped): on resume
/// the meter reads true again, the start check is in control, the parts the earlier check flagged are offered at once
/// and measured again on the operator's R, and every part ends in the cup the simulator's truth calls for (its side
/// channel, the outside reference). Virtual clock, real TCP socket and SQLite file.
/// </summary>
public sealed class ResumeFlaggedTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-resume-flagged-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Resume_WithFlaggedPartsWaiting_OffersThemAtOnce_AndMeasuresThemAgain()
    {
        const int parts = 40,
            every = 10,
            stepAt = 15;
        var options = new SortOptions
        {
            Database = Path.Combine(_dir, "resume-flagged.db"),
            Session = "resume-flagged",
            Parts = parts,
            Seed = 4242,
            Speech = false,
            Live = false,
            Check = "fixture:10000",
            CheckEvery = every,
        };

        // First run: the gain steps by 50 ppm after part 15; the check after part 20 is out of control and the
        // operator stops the session instead of answering (Ctrl+C).
        var ears = new ListeningAnnouncer();
        var first = new VirtualSort(ears);
        using var stop = new CancellationTokenSource();
        var stepped = false;
        ears.OnLine = line =>
        {
            if (!stepped && first.Services.Snapshot.Parts().Count >= stepAt)
            {
                first.Bench.StepGain(50);
                stepped = true;
            }

            if (line.Contains("out of control", StringComparison.Ordinal))
            {
                stop.Cancel();
            }
        };
        await Assert.ThrowsAnyAsync<OperationCanceledException>(() => first.RunAsync(options, ct: stop.Token));
        long sessionId;
        IReadOnlyList<long> waiting;
        await using (var log = await PrecisionLogFactory.OpenAsync(options.Database, null, default))
        {
            sessionId = Assert.Single(await log.ListSessionsAsync(default), s => s.Name == options.Session).Id;
            waiting = await log.GetSuspectPartsAsync(sessionId, default);
        }

        Assert.Equal(every, waiting.Count); // the parts since the last good check (11-20)

        // Resumed on a meter that reads true again: the waiting parts are offered before any new reel part.
        var ears2 = new ListeningAnnouncer();
        var second = new VirtualSort(ears2);
        var offered = 0;
        ears2.OnLine = line =>
        {
            if (line.Contains("wait to be measured again", StringComparison.Ordinal))
            {
                offered++;
                second.Services.Commands.Post(OperatorCommand.RemeasureFlagged); // the operator's answer
            }
        };
        var outcome = await second.RunAsync(options);

        Assert.Equal(1, offered);
        Assert.Contains($"{waiting.Count} parts flagged by an earlier check", ears2.Text, StringComparison.Ordinal);
        Assert.Equal(parts, outcome.PartsRecorded);
        await using var reopened = await PrecisionLogFactory.OpenAsync(options.Database, null, default);
        Assert.Empty(await reopened.GetSuspectPartsAsync(sessionId, default));
        var stored = await reopened.GetPartsAsync(sessionId, default);
        var byId = stored.ToDictionary(p => p.Id);
        foreach (var id in waiting)
        {
            var old = byId[id];
            Assert.Equal(PartState.Remeasured, old.State);
            Assert.True(byId[old.ReplacedBy!.Value].IsLive);
        }

        // Measured again before any new reel part: the records after the first run's 20 are the replacements.
        Assert.Equal(
            Enumerable.Range(2 * every + 1, waiting.Count),
            waiting.Select(id => byId[byId[id].ReplacedBy!.Value].Number).Order()
        );

        var position = ReelPositions.Of(stored);
        var live = stored.Where(p => p.IsLive).ToList();
        Assert.Equal(Enumerable.Range(0, parts), live.Select(p => position[p.Number]).Order());
        var (misplaced, excused) = TruthCheck.Compare(options, live, n => second.Bench.Truth(position[n]));
        Assert.Empty(misplaced);
        Assert.True(excused <= parts / 10, $"{excused} parts sat on a band edge");
    }
}
