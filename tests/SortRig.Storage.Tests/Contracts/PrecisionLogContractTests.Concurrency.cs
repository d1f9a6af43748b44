using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

public abstract partial class PrecisionLogContractTests
{
    [SkippableFact]
    public async Task TakeParts_TwoBenchesAtOnceFor200Rounds_NeverHandOnePartToBoth()
    {
        var benchA = await CreateLogAsync();
        var benchB = await CreateLogAsync(); // a second instance: its own connections, like a second bench PC
        var p = await StockLibraryAsync(benchA, 5, 10, 15, 20, 25, 30, 35, 40);
        var ids = p.Select(x => x.Id).ToArray();
        var random = new Random(20260302);
        var takes = new Dictionary<long, int>();

        for (int round = 0; round < 200; round++)
        {
            // Two random sets of three that always share at least one part.
            var setA = ids.OrderBy(_ => random.Next()).Take(3).ToArray();
            var setB = ids.Except(setA).OrderBy(_ => random.Next()).Take(2).Append(setA[random.Next(3)]).ToArray();
            var both = await Task.WhenAll(
                Task.Run(() => benchA.TakePartsAsync(setA, "bench-A", CancellationToken.None)),
                Task.Run(() => benchB.TakePartsAsync(setB, "bench-B", CancellationToken.None))
            );

            // All parts were free at the start of the round, so the first committer wins everything it asked for and
            // the other is refused as a whole.
            Assert.True(both[0].Succeeded ^ both[1].Succeeded, $"round {round}: exactly one bench must get its parts");
            var winner = both[0].Succeeded ? both[0] : both[1];
            var loser = both[0].Succeeded ? both[1] : both[0];
            Assert.Empty(loser.Changed);

            // The loser is told which parts and by whom: read under the lock of its refusal, so always the winner.
            Assert.Equal(loser.Refused.Order(), loser.Holders.Select(h => h.PartId));
            Assert.All(loser.Holders, h =>
                Assert.Equal((LibraryStatus.Taken, both[0].Succeeded ? "bench-A" : "bench-B"), (h.Status, h.TakenBy))
            );
            Assert.Equal(setA.Intersect(setB).Order(), loser.Refused.Order());
            foreach (var part in winner.Changed)
            {
                takes[part.Id] = takes.GetValueOrDefault(part.Id) + 1;
            }

            Assert.Equal(
                3,
                (
                    await benchA.FindPartsAsync(new LibraryQuery(Status: LibraryStatus.Taken), CancellationToken.None)
                ).Count
            );
            Assert.True(
                (
                    await benchB.ReleasePartsAsync(winner.Changed.Select(x => x.Id).ToArray(), CancellationToken.None)
                ).Succeeded
            );
        }

        Assert.Equal(600, takes.Values.Sum());
        foreach (var id in ids)
        {
            var history = await benchA.GetPartHistoryAsync(id, CancellationToken.None);
            Assert.Equal(takes.GetValueOrDefault(id), history.Count(e => e.Kind == PartEventKind.Taken));
        }

        Assert.True((await benchA.VerifyAsync(CancellationToken.None)).IsOk);
    }

    [SkippableFact]
    public async Task CommitPart_TwoBenchesCommittingAtOnce_EachSessionNumberedWithoutGapsOrRepeats()
    {
        var benchA = await CreateLogAsync();
        var benchB = await CreateLogAsync();
        var (sessionA, batchA) = await Bench.StartAsync(benchA, "r2r-ladder-A");
        var (sessionB, batchB) = await Bench.StartAsync(benchB, "r2r-ladder-B");

        async Task CommitMany(IPrecisionLog log, long sessionId, BatchInfo batch, int count)
        {
            for (int i = 0; i < count; i++)
            {
                await Bench.CommitAsync(log, sessionId, batch, 10_000 + (i * 0.1), "A", i);
            }
        }

        await Task.WhenAll(
            Task.Run(() => CommitMany(benchA, sessionA.Session.Id, batchA, 40)),
            Task.Run(() => CommitMany(benchB, sessionB.Session.Id, batchB, 40)),
            Task.Run(() => CommitMany(benchB, sessionA.Session.Id, batchA, 30))
        ); // a second writer into session A

        Assert.Equal(
            Enumerable.Range(1, 70),
            (await benchB.GetPartsAsync(sessionA.Session.Id, CancellationToken.None)).Select(p => p.Number)
        );
        Assert.Equal(
            Enumerable.Range(1, 40),
            (await benchA.GetPartsAsync(sessionB.Session.Id, CancellationToken.None)).Select(p => p.Number)
        );
        var reopened = await benchA.OpenOrResumeSessionAsync(
            new SessionRequest("r2r-ladder-A"),
            CancellationToken.None
        );
        Assert.Equal(71, reopened.NextPartNumber);
        Assert.True((await benchA.VerifyAsync(CancellationToken.None)).IsOk);
    }

    [SkippableFact]
    public async Task CommitPart_SameKeyFromTwoBenchesAtOnce_StoresOnePartPerKey()
    {
        var benchA = await CreateLogAsync();
        var benchB = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(benchA);

        for (int round = 0; round < 25; round++)
        {
            // A retry racing its own first attempt (e.g. a timed-out commit resent on a second connection).
            var commit = Bench.Part(session.Session.Id, batch, 10_000 + round, index: round);
            var both = await Task.WhenAll(
                Task.Run(() => benchA.CommitPartAsync(commit, CancellationToken.None)),
                Task.Run(() => benchB.CommitPartAsync(commit, CancellationToken.None))
            );

            Assert.Equal(both[0], both[1]);
            Assert.Equal(round + 1, both[0].Number);
        }

        Assert.Equal(25, (await benchA.GetPartsAsync(session.Session.Id, CancellationToken.None)).Count);
        Assert.True((await benchB.VerifyAsync(CancellationToken.None)).IsOk);
    }
}
