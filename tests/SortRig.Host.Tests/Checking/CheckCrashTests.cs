using System.Globalization;
using System.Text.RegularExpressions;
using SortRig.Host.Tests.Reliability;
using SortRig.Host.Tests.Reliability.Support;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Checking;

/// <summary>
/// Crash safety of the check standard, in the pattern of the crash tests (SORTRIG_CRASH_AT, SortRig.Host.dll run as a
/// process and killed with SIGKILL): killed between a check read and its record (check), and between the record and
/// anything else (checked), restarted each time with the same session. At the end no part is lost or doubled, the
/// checks are numbered without a gap, every check the operator heard is in the log, and the baseline holds exactly
/// the readings it needs: none lost, none counted twice.
/// </summary>
[Collection(ReliabilityCollection.Name)]
public sealed partial class CheckCrashTests(ITestOutputHelper output) : IDisposable
{
    private const int Parts = 20;
    private const int Baseline = 5;
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-checkcrash-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Sort_KilledWhileACheckIsRecorded_NothingLostNothingCountedTwice()
    {
        var db = Path.Combine(_dir, "check-crash.db");
        string[] kills = ["check:1", "checked:1", "checked:3", "check:2", "checked:2", "checked:4", "check:3"];
        var runs = new List<HostRun>();
        foreach (var crashAt in kills.Append(null))
        {
            var run = await HostProcess.RunAsync(_dir, Args(db), crashAt, null, null, TimeSpan.FromMinutes(2));
            runs.Add(run);
            output.WriteLine($"{crashAt ?? "finish", -10} exit {run.ExitCode, 3}");
            if (crashAt is null || run.ExitCode == 0)
            {
                Assert.Equal(0, run.ExitCode);
                break;
            }

            Assert.True(
                run.DiedOfSigkill,
                $"{crashAt}: exit {run.ExitCode}\n{string.Join('\n', run.Lines.TakeLast(15))}"
            );
        }

        Assert.True(runs.Count(r => r.DiedOfSigkill) >= 5, "the session ended before the kills were used");
        DatabaseChecks.AssertIntegrity(db);
        await using var log = await PrecisionLogFactory.OpenAsync(db, null, default);
        Assert.True((await log.VerifyAsync(default)).IsOk);
        var session = Assert.Single(await log.ListSessionsAsync(default), x => x.Name == "checkcrash");
        var parts = await log.GetPartsAsync(session.Id, default);
        Assert.Equal(Enumerable.Range(1, Parts), parts.Select(p => p.Number));
        Assert.All(parts, p => Assert.Equal(PartState.Announced, p.State));

        var checks = await log.GetSessionChecksAsync(session.Id, default);
        Assert.Equal(Enumerable.Range(1, checks.Count), checks.Select(c => c.Seq)); // one record per check, no gap
        Assert.Equal(Baseline, checks.Count(c => c.Commit.Rule == "Baseline")); // none lost, none counted twice
        Assert.All(checks, c => Assert.True(c.Commit.InControl, c.Commit.Reason));
        Assert.Empty(await log.GetFlaggedPartsAsync(session.Id, default));
        Assert.Equal(checks.Select(c => c.AfterPartNumber).Order(), checks.Select(c => c.AfterPartNumber));
        Assert.Equal(Parts, checks[^1].AfterPartNumber); // the check at the end

        // Every check the operator was told about is in the log.
        var heard = runs.SelectMany(r => r.Lines)
            .Select(l => HeardCheck().Match(l))
            .Where(m => m.Success)
            .Select(m => int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture))
            .Distinct()
            .ToList();
        Assert.NotEmpty(heard);
        Assert.All(heard, seq => Assert.Contains(checks, c => c.Seq == seq));
        output.WriteLine($"{checks.Count} checks, {heard.Count} heard, kills {runs.Count(r => r.DiedOfSigkill)}");
    }

    private static string[] Args(string db) =>
        [
            "sort",
            "--plain",
            "--no-speech",
            "--speed",
            "100",
            "--nplc",
            "10",
            "--parts",
            Parts.ToString(CultureInfo.InvariantCulture),
            "--db",
            db,
            "--session",
            "checkcrash",
            "--seed",
            "3117",
            "--check",
            "fixture:10000",
            "--check-every",
            "5",
        ];

    [GeneratedRegex(@"check (\d+) in control")]
    private static partial Regex HeardCheck();
}
