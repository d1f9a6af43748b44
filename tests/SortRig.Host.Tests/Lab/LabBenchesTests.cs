using System.Globalization;
using System.Text.RegularExpressions;
using SortRig.Host.Tests.Lab.Support;
using SortRig.Host.Tests.Reliability.Support;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Lab;

/// <summary>
/// A room of benches on one PostgreSQL server: eight host processes at once (four sorting sessions, two drift runs,
/// two benches racing for the same library parts), all logged in as the lab's writer role, sharing one library.
/// Outside reference for "nothing lost, nothing doubled": each sort's own count of parts (--parts) and the numbering
/// rule 1..n without gaps (docs/storage.md), each drift run's own printed count of scans and samples, and the
/// all-or-none library rule (a part is never held by two takers). Isolation semantics of the row locks that make
/// this hold: PostgreSQL 15 manual sec. 13.2.1 (Read Committed) and 13.3.2 (row-level locks).
/// </summary>
[Collection(ReliabilityCollection.Name)]
public sealed partial class LabBenchesTests(ITestOutputHelper output) : IDisposable
{
    private const int SortBenches = 4;
    private const int DriftBenches = 2;
    private const int PartsPerSort = 6;
    private const int TakeRounds = 3;
    private static readonly TimeSpan s_limit = TimeSpan.FromMinutes(6);
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-lab-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [LabFact]
    public async Task EightBenchProcesses_SortDriftAndRaceForParts_NothingLostDoubledOrDoubleBooked()
    {
        await using var lab = await LabStore.CreateAsync();
        var stock = await lab.StockLibraryAsync(8);

        var sorts = Enumerable
            .Range(1, SortBenches)
            .Select(n =>
                Host(
                    "sort",
                    "--plain",
                    "--no-speech",
                    "--speed",
                    "100",
                    "--nplc",
                    "10",
                    "--parts",
                    $"{PartsPerSort}",
                    "--seed",
                    $"{4100 + n}",
                    "--session",
                    $"lab-bench-{n}",
                    "--db",
                    lab.Writer
                )
            )
            .ToArray();
        var drifts = Enumerable
            .Range(1, DriftBenches)
            .Select(n =>
                Host(
                    "drift",
                    "--virtual",
                    "--channels",
                    "101-102",
                    "--hours",
                    "2",
                    "--interval",
                    "60",
                    "--seed",
                    $"{5100 + n}",
                    "--run",
                    $"lab-drift-{n}",
                    "--db",
                    lab.Writer
                )
            )
            .ToArray();
        var races = RaceForPartsAsync(lab, stock);

        var sortRuns = await Task.WhenAll(sorts);
        var driftRuns = await Task.WhenAll(drifts);
        var (winners, doubleBookings) = await races;

        await using var log = await lab.OpenAsync();
        int lost = 0,
            doubled = 0;
        for (int n = 1; n <= SortBenches; n++)
        {
            var run = sortRuns[n - 1];
            Assert.True(run.ExitCode == 0, $"sort bench {n} exit {run.ExitCode}: {run.Log}");
            var session = (await log.ListSessionsAsync(CancellationToken.None)).Single(x => x.Name == $"lab-bench-{n}");
            var parts = await log.GetPartsAsync(session.Id, CancellationToken.None);
            lost += PartsPerSort - parts.Select(p => p.Number).Distinct().Count();
            doubled += parts.Count - parts.Select(p => p.Number).Distinct().Count();
            Assert.Equal(Enumerable.Range(1, PartsPerSort), parts.Select(p => p.Number));
            Assert.All(parts, p => Assert.Equal(PartState.Announced, p.State));
            Assert.Equal(PartsPerSort, run.Lines.Count(l => CupLine().IsMatch(l)));
        }

        long driftLost = 0;
        for (int n = 1; n <= DriftBenches; n++)
        {
            var run = driftRuns[n - 1];
            Assert.True(run.ExitCode == 0, $"drift bench {n} exit {run.ExitCode}: {run.Log}");
            var said = run.Lines.Select(l => DriftLine().Match(l)).Single(m => m.Success);
            long scans = long.Parse(said.Groups["scans"].Value, CultureInfo.InvariantCulture);
            long samples = long.Parse(said.Groups["samples"].Value, CultureInfo.InvariantCulture);
            long runId = long.Parse(said.Groups["run"].Value, CultureInfo.InvariantCulture);
            Assert.Equal(120, scans); // 2 h at 60 s
            Assert.Equal(scans * 4, samples); // per scan: two parts, and the Pt100 read before and after them
            long stored = 0;
            await foreach (var _ in log.ReadDriftSamplesAsync(runId, CancellationToken.None))
            {
                stored++;
            }

            driftLost += samples - stored;
        }

        output.WriteLine(
            $"sort parts lost {lost}, doubled {doubled}; drift samples lost {driftLost}; take rounds won {winners}/"
                + $"{TakeRounds}, double-bookings {doubleBookings}"
        );
        Assert.Equal((0, 0, 0L, 0), (lost, doubled, driftLost, doubleBookings));
        Assert.Equal(TakeRounds, winners);
        foreach (var id in stock)
        {
            var history = await log.GetPartHistoryAsync(id, CancellationToken.None);
            var moves = history
                .Where(e => e.Kind is PartEventKind.Taken or PartEventKind.Released)
                .Select(e => e.Kind)
                .ToArray();
            for (int i = 1; i < moves.Length; i++)
            {
                Assert.NotEqual(moves[i - 1], moves[i]); // taken twice in a row would be a double booking
            }
        }

        Assert.True((await log.VerifyAsync(CancellationToken.None)).IsOk);
    }

    // Two benches (processes) ask for overlapping sets of the same stock at the same moment, round after round, while
    // the sorts and drift runs write. Exactly one wins each round; the other is refused, told which part and by whom.
    private async Task<(int Winners, int DoubleBookings)> RaceForPartsAsync(LabStore lab, long[] stock)
    {
        int winners = 0,
            doubleBookings = 0;
        for (int round = 0; round < TakeRounds; round++)
        {
            var a = stock.Skip(round).Take(3).ToArray();
            var b = stock.Skip(round + 2).Take(3).ToArray(); // shares a[2]
            var both = await Task.WhenAll(
                Host("library", "take", "--ids", string.Join(',', a), "--by", "bench-A", "--db", lab.Writer),
                Host("library", "take", "--ids", string.Join(',', b), "--by", "bench-B", "--db", lab.Writer)
            );
            var won = both.Count(r => r.ExitCode == 0);
            winners += won == 1 ? 1 : 0;
            doubleBookings += won > 1 ? 1 : 0;
            Assert.True(
                won == 1,
                $"round {round}: {won} benches won: {string.Join(" | ", both.Select(r => string.Join(' ', r.Lines)))}"
            );
            var loser = both.Single(r => r.ExitCode != 0);
            var winner = both[0].ExitCode == 0 ? "bench-A" : "bench-B";
            var told = string.Join('\n', loser.Lines);
            Assert.Contains($"{a[2]} (Taken by {winner})", told, StringComparison.Ordinal);

            await using var log = await lab.OpenAsync();
            Assert.True((await log.ReleasePartsAsync(both[0].ExitCode == 0 ? a : b, CancellationToken.None)).Succeeded);
        }

        return (winners, doubleBookings);
    }

    private Task<HostRun> Host(params string[] args) => HostProcess.RunAsync(_dir, args, null, null, null, s_limit);

    [GeneratedRegex(@"^part \d+: cup ")]
    private static partial Regex CupLine();

    [GeneratedRegex(@"drift run (?<run>\d+) '[^']*': (?<scans>\d+) scans, (?<samples>\d+) samples stored")]
    private static partial Regex DriftLine();
}
