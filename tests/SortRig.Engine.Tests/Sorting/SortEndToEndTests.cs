using SortRig.Engine.Announcing;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Sorting;

/// <summary>
/// The main job end to end: the embedded simulated meter on a real TCP socket, a reel with handling warm-up, the
/// settle rule (predictive by default, or averaging when chosen), the SQLite log and the cup assigner, on a test-driven
/// virtual clock (<see cref="VirtualSort"/>). The simulator's truth (its side channel) is the outside reference the
/// cups are checked against.
/// </summary>
public sealed class SortEndToEndTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-e2e-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Sort_Reel200_EveryPartInTheCupItsTrueValueCallsFor()
    {
        const int parts = 200;
        var announced = new StringWriter();
        var (options, sort, stored) = await SortAsync("e2e", parts, 4242, _ => { }, new PlainTextAnnouncer(announced));

        await using var log = await PrecisionLogFactory.OpenAsync(options.Database, null, default);
        foreach (var p in stored.Where(p => p.State != PartState.Announced))
        {
            var rs = await log.GetReadingsAsync(p.Id, default);
            var finite = rs.Where(r => r.Kind == ReadingKind.Finite).Select(r => r.Value).ToList();
            var gaps = rs.Zip(rs.Skip(1)).Select(z => (z.Second.Time - z.First.Time).TotalSeconds).Where(s => s > 1);
            var span = (rs[^1].Time - rs[0].Time).TotalSeconds;
            Assert.Fail(
                $"part {p.Number} is {p.State}: {rs.Count} readings over {span:F1} s, "
                    + $"{rs.Count - finite.Count} overloads, first {finite.FirstOrDefault():F3}, "
                    + $"last {finite.LastOrDefault():F3}, truth {sort.Bench.Truth(p.Number - 1):F3}; "
                    + "gaps > 1 s: "
                    + string.Join(", ", gaps.Select(s => $"{s:F1} s"))
            );
        }

        // Each part in the cup its true value calls for, its value within its stated uncertainty of the truth.
        var (misplaced, excused) = TruthCheck.Compare(options, stored, number => sort.Bench.Truth(number - 1));
        Assert.Empty(misplaced);
        Assert.True(excused <= parts / 20, $"{excused} parts sat on a band edge");

        // Every raw reading is kept; a value the averaging rule accepted is the mean of the last readings logged, one
        // the predictive rule (the sort's default) accepted carries its fit.
        foreach (var part in stored)
        {
            var readings = await log.GetReadingsAsync(part.Id, default);
            Assert.True(readings.Count >= 8, $"part {part.Number} has {readings.Count} readings");
            if (part.AcceptedBy == SettleRule.Predictive)
            {
                Assert.NotNull(part.Fit);
                continue;
            }

            var window = readings.TakeLast(8).Select(r => r.Value).Average();
            Assert.Equal(part.Value, window, 6);
        }

        Assert.Contains(stored, p => p.AcceptedBy == SettleRule.Predictive);

        // Announcements went out once per part, in order.
        var said = Announcements.Cups(announced.ToString()).Select(h => $"{h.Part}:{h.Cup}");
        Assert.Equal(stored.Select(p => $"{p.Number}:{p.CupLabel}"), said);
    }

    // The symptom of docs/range-transfer.md: 20 kOhm parts at a 0.05 % match read on the 100 k range, which the
    // range rule accepts; with a settle target of 2.5 ppm every part ended "unstable". Now each settles into a cup.
    [Fact]
    public async Task Sort_20kAt005Percent_OnThe100kRange_EveryPartSettlesIntoItsTrueCup()
    {
        var (options, sort, stored) = await SortAsync(
            "e2e-20k",
            6,
            4243,
            o => (o.Nominal, o.MatchTolerance) = (20_000, 0.0005),
            new PlainTextAnnouncer(TextWriter.Null)
        );

        Assert.All(stored, p => Assert.Equal(PartState.Announced, p.State));
        Assert.All(stored, p => Assert.Equal(100_000, p.Range));

        // Simulator truth (its side channel) is the outside reference: each value within its stated U (k = 2).
        var (misplaced, _) = TruthCheck.Compare(options, stored, number => sort.Bench.Truth(number - 1));
        Assert.Empty(misplaced);
    }

    // Sorting with the predictive settle rule chosen (--settle predictive) on the simulator's simple physics, on which
    // docs/bench-settle.md found the rule clean.
    [Fact]
    public async Task Sort_PredictiveRule_LogsTheRuleForEveryPart_AndEveryPartInItsTrueCup()
    {
        const int parts = 24;
        var snapshot = new BenchSnapshot();
        var (options, sort, stored) = await SortAsync(
            "e2e-predictive",
            parts,
            5150,
            o => o.Settle = SettleRule.Predictive,
            new PlainTextAnnouncer(TextWriter.Null),
            snapshot
        );

        Assert.All(stored, p => Assert.Equal(PartState.Announced, p.State));

        // Every part says which rule accepted it; a predictive acceptance carries its fit, an averaging one none.
        Assert.All(stored, p => Assert.NotNull(p.AcceptedBy));
        Assert.All(stored.Where(p => p.AcceptedBy == SettleRule.Predictive), p =>
        {
            var fit = Assert.IsType<RecoveryFit>(p.Fit);
            Assert.Equal((int)fit.Model, fit.TimeConstantsSeconds.Count);
            Assert.True(fit.StandardUncertainty > 0, $"part {p.Number}: fit uncertainty {fit.StandardUncertainty}");
        });
        Assert.All(stored.Where(p => p.AcceptedBy == SettleRule.Averaging), p => Assert.Null(p.Fit));

        // The rule was really on: on the simple bench it accepts most parts before the averaging rule does.
        Assert.Contains(stored, p => p.AcceptedBy == SettleRule.Predictive);
        Assert.Equal(
            stored.Select(p => p.AcceptedBy?.ToString()),
            snapshot.Parts().OrderBy(v => v.Number).Select(v => v.AcceptedBy)
        );

        // Simulator truth (its side channel) is the outside reference: each value within its stated U (k = 2), each
        // part in the cup its true value calls for unless a band edge lies within that U.
        var (misplaced, excused) = TruthCheck.Compare(options, stored, number => sort.Bench.Truth(number - 1));
        Assert.Empty(misplaced);
        Assert.True(excused <= parts / 8, $"{excused} parts sat on a band edge");
    }

    // One session of the demo reel on the virtual clock: every part recorded, in order.
    private async Task<(SortOptions Options, VirtualSort Sort, IReadOnlyList<PartRecord> Stored)> SortAsync(
        string session,
        int parts,
        int seed,
        Action<SortOptions> adjust,
        IAnnouncer announcer,
        BenchSnapshot? snapshot = null
    )
    {
        var options = new SortOptions
        {
            Database = Path.Combine(_dir, session + ".db"),
            Session = session,
            Parts = parts,
            Seed = seed,
            Speech = false,
            Live = false,
        };
        adjust(options);
        var sort = new VirtualSort(announcer, snapshot);

        var outcome = await sort.RunAsync(options, limit: TimeSpan.FromMinutes(6));

        Assert.Equal(parts, outcome.PartsRecorded);
        await using var log = await PrecisionLogFactory.OpenAsync(options.Database, null, default);
        var stored = await log.GetPartsAsync(outcome.SessionId, default);
        Assert.Equal(Enumerable.Range(1, parts), stored.Select(p => p.Number));
        return (options, sort, stored);
    }
}
