using SortRig.Engine.Sorting;
using SortRig.Engine.Tests.Reliability.Support;
using SortRig.Simulator.Operator;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Sorting;

/// <summary>The operator is told when to put the first part in: after the meter is set up, not while it
/// connects.</summary>
[Collection(ReliabilityCollection.Name)]
[Trait(ReliabilityCollection.Clock, ReliabilityCollection.Wall)]
public sealed class ReadyCueTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-cue-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Ready_IsAnnouncedWithTheFixtureEmpty_ThenTheEmbeddedOperatorFeedsTheReel()
    {
        var sort = new InProcessSort(
            new SortOptions
            {
                Database = Path.Combine(_dir, "cue.db"),
                Session = "cue",
                Parts = 2,
                Seed = 31,
                Speed = 50,
                Speech = false,
                Live = false,
            }
        );
        using var cts = new CancellationTokenSource(TimeSpan.FromSeconds(60));
        var readyLines = new List<string>();
        var fixtureAtReady = new List<bool>();
        sort.Ears.OnLine = line =>
        {
            if (line.Contains("ready:", StringComparison.Ordinal))
            {
                readyLines.Add(line);
                fixtureAtReady.Add(sort.Bench.IsCompletedSuccessfully ? sort.Bench.Result.Fixture.IsOccupied : true);
            }
        };

        var run = sort.RunAsync(null, cts.Token);
        var bench = await sort.Bench;
        var outcome = await run;

        // Setup (connect, identify, configure, read back) takes several virtual seconds at NPLC 10 on the
        // simulator; an operator feeding from the moment the bench served would have had part 1 in by then.
        Assert.Equal(2, outcome.PartsRecorded);
        var line = Assert.Single(readyLines);
        Assert.Contains("put part 1 in the fixture", line, StringComparison.Ordinal);
        Assert.False(Assert.Single(fixtureAtReady));
        Assert.Equal(OperatorMode.OnCue, bench.Options.Operator.Mode);
        Assert.Equal(0, bench.Operator.DwellTimeouts);
    }
}
