using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Engine.Announcing;
using SortRig.Engine.Composition;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Host.Live;
using SortRig.Measurement.Settling;
using SortRig.Simulator;
using SortRig.Simulator.Physics;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Spectre.Console;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Sorting;

/// <summary>
/// Issue #13's end-to-end check: 200 parts sorted with the predictive settle rule on the simulator's rich physics
/// (two thermal paths, self-heating, ambient wander, 1/f noise, popcorn) over its real TCP socket, into the SQLite
/// log, on a test-driven virtual clock (tests/Support/VirtualSort.cs). The simulator's truth (its side channel) is the
/// outside reference the cups are checked against; the session summary's pace (parts per hour) is printed to the test
/// output.
/// </summary>
[Collection(ReliabilityCollection.Name)]
public sealed class SortPredictiveRichEndToEndTests(ITestOutputHelper output) : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-e2e-rich-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Sort_200PartsRichPhysicsPredictive_NoPartInTheWrongCup_SummaryGivesPartsPerHour()
    {
        const int parts = 200;
        var options = new SortOptions
        {
            Database = Path.Combine(_dir, "rich.db"),
            Session = "e2e-rich",
            Settle = SettleRule.Predictive,
            Physics = PhysicsModel.Rich,
            Parts = parts,
            Seed = 1313,
            Speech = false,
            Live = false,
        };
        var snapshot = new BenchSnapshot();
        var sort = new VirtualSort(new PlainTextAnnouncer(new StringWriter()), snapshot);

        var outcome = await sort.RunAsync(options, limit: TimeSpan.FromMinutes(15));
        var bench = sort.Bench;

        Assert.Equal(parts, outcome.PartsRecorded);
        await using var log = await PrecisionLogFactory.OpenAsync(options.Database, null, default);
        var stored = await log.GetPartsAsync(outcome.SessionId, default);
        Assert.All(stored, p => Assert.Equal(PartState.Announced, p.State));
        Assert.All(stored, p => Assert.NotNull(p.AcceptedBy));

        // Simulator truth is the outside reference: each value within its stated U (k = 2), each part in the cup its
        // true value calls for unless a band edge lies within that U.
        var (misplaced, excused) = TruthCheck.Compare(options, stored, number => bench.Truth(number - 1));
        Assert.Empty(misplaced);
        Assert.True(excused <= parts / 8, $"{excused} parts sat on a band edge");

        // The summary the operator sees at the end states the pace.
        var printed = new StringWriter();
        var console = AnsiConsole.Create(
            new AnsiConsoleSettings { Out = new AnsiConsoleOutput(printed), Ansi = AnsiSupport.No }
        );
        SortSummary.Write(console, outcome, snapshot);
        output.WriteLine(printed.ToString());
        var pace = SortPace.From(snapshot.Parts().Where(p => p.State is "Accepted" or "Announced").Select(p => p.Time));
        Assert.NotNull(pace.PartsPerHour);
        Assert.Contains("parts per hour", printed.ToString(), StringComparison.Ordinal);
        output.WriteLine($"predictive {stored.Count(p => p.AcceptedBy == SettleRule.Predictive)} of {stored.Count}");
    }
}
