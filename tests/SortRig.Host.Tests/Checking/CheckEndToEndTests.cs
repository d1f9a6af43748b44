using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Host.Tests.Reliability.Support;
using SortRig.Host.Tests.Sorting;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;

namespace SortRig.Host.Tests.Checking;

/// <summary>
/// The check standard end to end on the embedded simulator (real TCP socket, SQLite file): the meter's gain steps by
/// 50 ppm in the middle of a 200-part sort; the session pauses at the next check, the parts since the last good check
/// are flagged, measured again after the operator's answer, and no part ends in the wrong cup against the simulator's
/// truth (its side channel, the outside reference). Test-driven virtual clock
/// (tests/Support/VirtualSort.cs). Self-contained: one file, the shared harness only.
/// </summary>
[Collection(ReliabilityCollection.Name)]
public sealed class CheckEndToEndTests : IDisposable
{
    private const string RemeasuredAs = SortingLoop.RemeasuredAs;
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-check-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Sort_GainStepsBy50PpmMidReel_PausesFlagsAndRemeasures_NoPartInTheWrongCup()
    {
        const int parts = 200,
            every = 20,
            stepAt = 110;
        var options = new SortOptions
        {
            Database = Path.Combine(_dir, "check.db"),
            Session = "check-e2e",
            Parts = parts,
            Seed = 4242,
            Speech = false,
            Live = false,
            Check = "fixture:10000",
            CheckEvery = every,
            // The subject is the 50 ppm step (10 sigma at this floor). The simulated check scatters by about 2 ppm,
            // the default floor: its charts then see a false alarm in a few percent of four-check stretches (Western
            // Electric rules, common practice, no source), which paused one CI run a second time.
            CheckSigmaFloorPpm = 5,
        };
        var ears = new ListeningAnnouncer();
        var sort = new VirtualSort(ears);
        var pauses = 0;
        var stepped = false;
        ears.OnLine = line =>
        {
            if (!stepped && sort.Services.Snapshot.Parts().Count >= stepAt)
            {
                sort.Bench.StepGain(50); // the fault: every range reads 50 ppm high from the next conversion on
                stepped = true;
            }

            if (line.Contains("out of control", StringComparison.Ordinal))
            {
                pauses++;
                Assert.True(sort.Services.Snapshot.Session!.Paused, "the session pauses at the check out of control");
                sort.Services.Commands.Post(OperatorCommand.RemeasureFlagged); // the operator's answer
            }
        };
        var outcome = await sort.RunAsync(options, limit: TimeSpan.FromMinutes(9));
        var bench = sort.Bench;

        Assert.Equal(parts, outcome.PartsRecorded);
        Assert.Equal(50, bench.GainStepPpm);
        Assert.True(pauses == 1, $"{pauses} pauses:\n{string.Join('\n', ears.Text.Split('\n').Where(IsCheckLine))}");
        await using var log = await PrecisionLogFactory.OpenAsync(options.Database, null, default);
        var checks = await log.GetSessionChecksAsync(outcome.SessionId, default);
        var stored = await log.GetPartsAsync(outcome.SessionId, default);

        // Exactly one check out of control, the first after the step; it flagged the parts since the last good check.
        var bad = Assert.Single(checks, c => !c.Commit.InControl);
        var lastGood = checks.Last(c => c.Seq < bad.Seq && c.Commit.InControl);
        Assert.InRange(bad.AfterPartNumber, stepAt, stepAt + every);
        Assert.Equal(bad.AfterPartNumber - lastGood.AfterPartNumber, bad.FlaggedCount);
        var flagged = await log.GetFlaggedPartsAsync(outcome.SessionId, default);
        Assert.Equal(
            stored.Where(p => p.Number > lastGood.AfterPartNumber && p.Number <= bad.AfterPartNumber).Select(p => p.Id),
            flagged
        );
        Assert.Empty(await log.GetSuspectPartsAsync(outcome.SessionId, default)); // all measured again

        // The re-reference saw the step: re-seated as often as the baseline, the meter read about 50 ppm high
        // against the check's centre, and its mean is what the scale puts back on the centre.
        var reReference = checks.Where(c => c.Commit.Rule == "ReReferenced").ToList();
        Assert.Equal(new SortOptions().CheckBaseline, reReference.Count);
        var mean = reReference.Average(c => c.Commit.ValueOhms);
        var shiftPpm = ((mean / reReference[0].Commit.CentreOhms!.Value) - 1) * 1e6;
        Assert.InRange(shiftPpm, 40, 60);
        Assert.All(reReference, c => Assert.Equal(c.Commit.CentreOhms!.Value / mean, c.Commit.ScaleFactor, 12));
        Assert.All(checks.Where(c => c.Seq > reReference[^1].Seq), c =>
            Assert.True(c.Commit.InControl, c.Commit.Reason)
        );

        // The link is a column (schema version 6) and agrees with the history note the operator reads.
        foreach (var id in flagged)
        {
            var old = stored.Single(p => p.Id == id);
            Assert.Equal(PartState.Remeasured, old.State);
            var note = (await log.GetPartHistoryAsync(id, default))
                .Select(e => e.Note)
                .Single(n => n?.StartsWith(RemeasuredAs, StringComparison.Ordinal) == true)!;
            var newNumber = int.Parse(note[RemeasuredAs.Length..], System.Globalization.CultureInfo.InvariantCulture);
            Assert.Equal(stored.Single(p => p.Number == newNumber).Id, old.ReplacedBy);
        }

        var position = ReelPositions.Of(stored);
        var live = stored.Where(p => p.IsLive).ToList();
        Assert.Equal(parts, live.Count);
        Assert.Equal(Enumerable.Range(0, parts), live.Select(p => position[p.Number]).Order());
        var (misplaced, excused) = TruthCheck.Compare(options, live, number => bench.Truth(position[number]));
        Assert.Empty(misplaced);
        Assert.True(excused <= parts / 20, $"{excused} parts sat on a band edge");
    }

    private static bool IsCheckLine(string line) =>
        line.Contains(" control", StringComparison.Ordinal) || line.Contains("re-referenced", StringComparison.Ordinal);
}
