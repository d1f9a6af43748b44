using System.Globalization;
using SortRig.Host.Cli;
using SortRig.Host.ReportVerb;
using SortRig.Host.Tests.Reports;
using SortRig.Measurement.Uncertainty;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.Tests.Checking;

/// <summary>
/// The report of a session that read a check: the control chart PNG and the meter-health table across sessions, the
/// gains recomputed here from the stored readings. Invented demo data (a 10 kOhm check, two sessions a month apart).
/// </summary>
public sealed class CheckReportTests : IDisposable
{
    private static readonly DateTimeOffset s_t0 = new(2026, 3, 2, 8, 0, 0, TimeSpan.Zero);
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-checkreport-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Report_SessionWithChecks_ChartAndMeterHealthWarnWhenMovedBeyondOneYearSpec()
    {
        var db = Path.Combine(_dir, "bench.db");
        double[] monday = [10_000.10, 10_000.12, 10_000.09, 10_000.11, 10_000.10, 10_000.12];
        double[] tuesday = [10_002.10, 10_002.12, 10_002.08, 10_002.11, 10_002.40]; // the meter moved ~ +200 ppm
        await using (var log = await PrecisionLogFactory.OpenAsync(db, null, default))
        {
            await SessionAsync(log, "monday", monday, s_t0, outOfControlLast: false);
            await SessionAsync(log, "tuesday", tuesday, s_t0.AddDays(30), outOfControlLast: true);
        }

        var folder = Path.Combine(_dir, "report");
        var printed = new StringWriter();
        var console = AnsiConsole.Create(
            new AnsiConsoleSettings { Out = new AnsiConsoleOutput(printed), Ansi = AnsiSupport.No }
        );
        var exit = await ReportCommand.RunAsync(new ReportRequest(db, folder, "tuesday", null), console, default);

        Assert.Equal(0, exit);
        PngCheck.AssertImage(Path.Combine(folder, "check_chart.png"), 1200, 800);
        var md = await File.ReadAllTextAsync(Path.Combine(folder, "meter_health.md"));

        // Gains recomputed here: mean of (reading / 10 000 - 1) * 1e6 per session.
        var gainMonday = monday.Average(v => ((v / 10_000) - 1) * 1e6); // 10.7 ppm
        var gainTuesday = tuesday.Average(v => ((v / 10_000) - 1) * 1e6); // 216.2 ppm
        Assert.Contains(
            Invariant($"| monday | 2026-03-02 08:00 | 6 | {gainMonday:+0.0} | +0.0 | ok |"),
            md,
            StringComparison.Ordinal
        );
        // Simulator profile, 100 kOhm range, one year: 0.0095 % of reading + 0.0006 % of range at 10 kOhm = 155 ppm.
        Assert.Contains("allowed movement 155.0 ppm", md, StringComparison.Ordinal);
        Assert.Contains(
            string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"| tuesday | 2026-04-01 08:00 | 5 | {gainTuesday:+0.0} | {gainTuesday - gainMonday:+0.0} | the "
                    + $"meter moved"
            ),
            md,
            StringComparison.Ordinal
        );
    }

    private static string Invariant(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);

    private static async Task SessionAsync(
        IPrecisionLog log,
        string name,
        double[] checks,
        DateTimeOffset at,
        bool outOfControlLast
    )
    {
        var session = await log.OpenOrResumeSessionAsync(new SessionRequest(name), default);
        var batch = await log.StartBatchAsync(
            session.Session.Id,
            new BatchSetup(10_000, 10_000, 1_000, 100_000, 10, true, "simulator", "SortRig,SIM-6H,1,1.0"),
            default
        );
        for (var i = 0; i < 3; i++)
        {
            var v = 10_000 + i;
            await log.CommitPartAsync(
                new PartCommit(
                    Guid.NewGuid(),
                    session.Session.Id,
                    batch.Id,
                    new MeasuredValue(v, v * 12e-6, v * 1.5e-6),
                    100_000,
                    10,
                    23,
                    at,
                    "A",
                    null,
                    []
                ),
                default
            );
        }

        for (var i = 0; i < checks.Length; i++)
        {
            var bad = outOfControlLast && i == checks.Length - 1;
            await log.RecordCheckAsync(
                new CheckCommit(
                    Guid.NewGuid(),
                    session.Session.Id,
                    "fixture:10000",
                    at.AddMinutes(i),
                    checks[i],
                    100_000,
                    0.02,
                    10_000,
                    checks[0],
                    0.02,
                    !bad,
                    bad ? "BeyondThreeSigma" : "None",
                    bad ? "the check read +14.5 sigma from its centre" : null
                ),
                default
            );
        }

        await log.FinishSessionAsync(session.Session.Id, default);
    }
}
