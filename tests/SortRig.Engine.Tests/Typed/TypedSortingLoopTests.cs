using System.Threading.Channels;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Time.Testing;
using SortRig.Engine.Announcing;
using SortRig.Engine.Composition;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Engine.Typed;
using SortRig.Storage;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Tests.Typed;

/// <summary>
/// The typed sorting loop in-process on a virtual clock and a real SQLite file: entries a few (virtual) seconds apart,
/// an entry too soon, an undo typed by the operator, and what the precision log keeps.
/// </summary>
public sealed class TypedSortingLoopTests
{
    [Fact]
    public async Task TypedParts_WithUndo_LogKeepsHistory_CupForgetsThePart()
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-typed-loop-");
        try
        {
            var time = new FakeTimeProvider(new DateTimeOffset(2026, 12, 3, 9, 0, 0, TimeSpan.Zero));
            var heard = new StringWriter();
            var snapshot = new BenchSnapshot();
            var services = new SortServices(
                time,
                new BenchEventHub(time),
                snapshot,
                new OperatorCommands(),
                new PlainTextAnnouncer(heard),
                NullLoggerFactory.Instance
            );
            var options = new SortOptions
            {
                Resource = "TYPED::handheld-typed",
                Database = Path.Combine(dir.FullName, "loop.db"),
                Session = "loop",
                Parts = 3,
                Speech = false,
            };
            var entries = new TypedEntries();
            var prompts = Channel.CreateUnbounded<string>();
            entries.Prompted += p => prompts.Writer.TryWrite(p);
            using var limit = new CancellationTokenSource(TimeSpan.FromSeconds(60));
            var run = Task.Run(() => TypedRunner.RunAsync(options, services, entries, null, limit.Token));

            async Task<string> StepAsync(string line, TimeSpan after)
            {
                time.Advance(after);
                await entries.PostAsync(line, limit.Token);
                return await prompts.Reader.ReadAsync(limit.Token);
            }

            Assert.StartsWith(
                "range set on the meter",
                await prompts.Reader.ReadAsync(limit.Token),
                StringComparison.Ordinal
            );
            Assert.StartsWith("part 1: type the display", await StepAsync("", TimeSpan.Zero), StringComparison.Ordinal);
            Assert.StartsWith(
                "part 1: got 10.003 kOhm (1 of 2)",
                await StepAsync("10.003", TimeSpan.Zero),
                StringComparison.Ordinal
            );
            Assert.StartsWith(
                "part 2: type the display",
                await StepAsync("10.004", TimeSpan.FromSeconds(3)),
                StringComparison.Ordinal
            );
            Assert.StartsWith(
                "part 2: type the display",
                await StepAsync("undo", TimeSpan.Zero),
                StringComparison.Ordinal
            );
            await StepAsync("9.990", TimeSpan.FromSeconds(5));
            Assert.StartsWith(
                "part 3: type the display",
                await StepAsync("9.990", TimeSpan.FromSeconds(3)),
                StringComparison.Ordinal
            );
            await StepAsync("10.001", TimeSpan.FromSeconds(5));
            Assert.Equal(
                "part 3: that was only 1.0 s after the last entry, not counted: let go of the part, wait 3 s, read "
                    + "again",
                await StepAsync("10.001", TimeSpan.FromSeconds(1))
            );
            time.Advance(TimeSpan.FromSeconds(3));
            await entries.PostAsync("10.002", limit.Token);
            var outcome = await run;

            Assert.Equal(3, outcome.PartsRecorded);
            Assert.Equal(2, outcome.Accepted);
            var text = heard.ToString();
            Assert.Contains("part 1: cup ", text, StringComparison.Ordinal);
            Assert.Contains("part 1 undone: take it out of ", text, StringComparison.Ordinal);
            await using var log = await PrecisionLogFactory.OpenAsync(options.Database, null, CancellationToken.None);
            var parts = await log.GetPartsAsync(outcome.SessionId, CancellationToken.None);
            Assert.Equal(
                [PartState.Undone, PartState.Announced, PartState.Announced],
                parts.OrderBy(p => p.Number).Select(p => p.State)
            );
            Assert.Equal(10_003.5, parts[0].Value, 9); // mean of the two agreeing entries
            Assert.Equal(10_001.5, parts[2].Value, 9); // the entry 1 s early was not counted
            Assert.Equal(2, (await log.GetReadingsAsync(parts[2].Id, CancellationToken.None)).Count);
            // The undone part no longer counts in its cup: two live parts in the cups in all.
            Assert.Equal(2, snapshot.Counts.Values.Sum());
            Assert.True((await log.ListSessionsAsync(CancellationToken.None)).Single().FinishedAt is not null);
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }
}
