using SortRig.Engine.Composition;
using SortRig.Engine.Simulation;
using SortRig.Engine.Sorting;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Sorting;

/// <summary>
/// Ctrl+C after a part's cup was said stops the session as a stop: the run itself ends in cancellation, never as a
/// finished session, so the verb reports exit 130 and the resume command (a finished outcome reads as exit 0 with the
/// reel cut short), and no later part is announced. The stop is requested inside the loop's own flow (the announcer
/// runs in it), so it lands at the same point every time. Virtual clock, real TCP socket and SQLite file.
/// </summary>
public sealed class StopBetweenPartsTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-stop-between-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task StopRequested_AsPartThreeIsAnnounced_EndsInCancellation_NotAsAFinishedSession()
    {
        var options = new SortOptions
        {
            Database = Path.Combine(_dir, "stop-between.db"),
            Session = "stop-between",
            Parts = 12,
            Seed = 77,
            Speech = false,
            Live = false,
        };
        var ears = new ListeningAnnouncer();
        var sort = new VirtualSort(ears);
        using var stop = new CancellationTokenSource();
        ears.OnLine = line =>
        {
            if (line.StartsWith("part 3: cup", StringComparison.Ordinal))
            {
                stop.Cancel(); // as the console's SIGINT handler does, at this instant
            }
        };

        // The run's own task, not the harness's: the harness reports any stop as a cancellation.
        var run = SortRunner.RunWithHooksAsync(
            options,
            sort.Services,
            new SimulatorHooks { OperatorTime = sort.Clock.OperatorView },
            stop.Token
        );
        using var limit = new CancellationTokenSource(TimeSpan.FromMinutes(3));
        await sort.Clock.DriveAsync(run.ContinueWith(_ => { }, TaskScheduler.Default), null, limit.Token);

        await Assert.ThrowsAnyAsync<OperationCanceledException>(() => run);
        Assert.Contains("part 3: cup", ears.Text, StringComparison.Ordinal);
        Assert.DoesNotContain("part 4: cup", ears.Text, StringComparison.Ordinal);
    }
}
