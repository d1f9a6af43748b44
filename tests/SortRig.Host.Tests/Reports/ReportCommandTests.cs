using CsvHelper;
using SortRig.Engine.DriftLogging;
using SortRig.Host.Cli;
using SortRig.Host.ReportVerb;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Cups;
using SortRig.Reporting.Reports;
using SortRig.Simulator;
using SortRig.Simulator.Physics;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Spectre.Console;

namespace SortRig.Host.Tests.Reports;

/// <summary>
/// The report verb on a real SQLite log holding a sorted session (two nominals, 12 fixed cups) and a 2-hour
/// drift run of four parts (virtual time, simulator over TCP). The numbers behind the plots are recomputed
/// here from the database, independently of the report code.
/// </summary>
public sealed class ReportCommandTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-report-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Report_SessionAndDriftRun_PngsDecodeAtSizeAndDataMatchesTheLog()
    {
        var db = Path.Combine(_dir, "bench.db");
        var sessionId = await SortedSessionAsync(db);
        var drift = new DriftOptions
        {
            Database = db,
            Channels = "101-104",
            IntervalSeconds = 60,
            Hours = 2,
            Seed = 9,
        }.Validate();
        var (outcome, _) = await DriftRuns.RunAsync(drift);
        var folder = Path.Combine(_dir, "report");
        var printed = new StringWriter();
        var console = AnsiConsole.Create(
            new AnsiConsoleSettings { Out = new AnsiConsoleOutput(printed), Ansi = AnsiSupport.No }
        );

        var exit = await ReportCommand.RunAsync(
            new ReportRequest(db, folder, "reel-7", outcome.RunId),
            console,
            default
        );

        Assert.Equal(0, exit);
        Assert.DoesNotContain("not drawn", printed.ToString(), StringComparison.Ordinal);
        var pngs = Directory.GetFiles(folder, "*.png").Select(Path.GetFileName).Order().ToArray();
        Assert.Equal(
            [
                "adev_ch101.png",
                "adev_ch102.png",
                "adev_ch103.png",
                "adev_ch104.png",
                "drift_ch101.png",
                "drift_ch102.png",
                "drift_ch103.png",
                "drift_ch104.png",
            ],
            pngs.Where(p => !p!.StartsWith("histogram_", StringComparison.Ordinal))
        );
        Assert.Equal(2, pngs.Count(p => p!.StartsWith("histogram_", StringComparison.Ordinal)));
        foreach (var png in pngs)
        {
            PngCheck.AssertImage(Path.Combine(folder, png!), 1200, 800);
            Assert.Contains(png!, printed.ToString(), StringComparison.Ordinal); // the verb lists what it wrote
        }

        await using var log = await PrecisionLogFactory.OpenAsync(db, null, default);

        // Histograms: parts per bin, counted here from the stored values, equal the counts drawn.
        var parts = (await log.GetPartsAsync(sessionId, default)).Where(p => p.IsLive).ToList();
        var bins = Directory.GetFiles(folder, "histogram_*_bins.csv").SelectMany(Read<HistogramBinCsvRow>).ToList();
        Assert.Equal(parts.Count, bins.Sum(b => b.Count));
        foreach (var bin in bins)
        {
            var expected = parts.Count(p =>
                p.Nominal.Equals(bin.NominalOhms)
                && ((p.Value / p.Nominal) - 1) * 1e6 >= bin.LowPpm
                && ((p.Value / p.Nominal) - 1) * 1e6 < bin.HighPpm
            );
            Assert.Equal(expected, bin.Count);
        }

        // Drift plots: one point per stored sample of each part channel; the Pt100's own channel is not plotted.
        var stored = new Dictionary<int, int>();
        await foreach (var s in log.ReadDriftSamplesAsync(outcome.RunId, default))
        {
            stored[s.Channel] = stored.GetValueOrDefault(s.Channel) + 1;
        }

        var rows = Read<DriftCsvRow>(Path.Combine(folder, "drift_samples.csv"));
        for (var i = 0; i < 4; i++)
        {
            Assert.Equal(120, stored[i]);
            Assert.Equal(stored[i], rows.Count(r => r.Channel == $"ch{101 + i}"));
        }

        Assert.Equal(4 * 120, rows.Length);
        Assert.True(File.Exists(Path.Combine(folder, ReportWriter.SummaryFileName)));

        // Every part of this session was committed at one instant: no time between acceptances, so no pace line
        // (a pace of 0 s per part would be a lie).
        Assert.Single(parts.Select(p => p.AcceptedAt).Distinct());
        Assert.DoesNotContain(
            "Pace:",
            await File.ReadAllTextAsync(Path.Combine(folder, ReportWriter.SummaryFileName)),
            StringComparison.Ordinal
        );
    }

    [Fact]
    public async Task Report_UnknownSession_ExitsTwoNamingTheSessions()
    {
        var db = Path.Combine(_dir, "empty.db");
        await SortedSessionAsync(db);
        var printed = new StringWriter();
        var console = AnsiConsole.Create(
            new AnsiConsoleSettings { Out = new AnsiConsoleOutput(printed), Ansi = AnsiSupport.No }
        );

        var exit = await ReportCommand.RunAsync(
            new ReportRequest(db, Path.Combine(_dir, "r"), "no-such", null),
            console,
            default
        );

        Assert.Equal(2, exit);
        Assert.Contains("'reel-7'", printed.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Report_PlantedLinkInTheFolder_Refused_TargetUntouched_ExistingFolderNeedsForce()
    {
        var db = Path.Combine(_dir, "links.db");
        await SortedSessionAsync(db);
        var folder = Directory.CreateDirectory(Path.Combine(_dir, "out")).FullName;
        var target = Path.Combine(_dir, "precious.txt");
        await File.WriteAllTextAsync(target, "keep me");
        File.CreateSymbolicLink(Path.Combine(folder, ReportWriter.SummaryFileName), target);
        var printed = new StringWriter();
        var console = AnsiConsole.Create(
            new AnsiConsoleSettings { Out = new AnsiConsoleOutput(printed), Ansi = AnsiSupport.No }
        );

        var linked = await ReportCommand.RunAsync(
            new ReportRequest(db, folder, "reel-7", null, Force: true),
            console,
            default
        );
        File.Delete(Path.Combine(folder, ReportWriter.SummaryFileName));
        await File.WriteAllTextAsync(Path.Combine(folder, "old.txt"), "an earlier report");
        var occupied = await ReportCommand.RunAsync(new ReportRequest(db, folder, "reel-7", null), console, default);
        var forced = await ReportCommand.RunAsync(
            new ReportRequest(db, folder, "reel-7", null, Force: true),
            console,
            default
        );
        var onAFile = await ReportCommand.RunAsync(new ReportRequest(db, target, "reel-7", null), console, default);

        Assert.Equal((2, 2, 0, 2), (linked, occupied, forced, onAFile));
        Assert.Equal("keep me", await File.ReadAllTextAsync(target));
        Assert.Contains("symbolic link", printed.ToString(), StringComparison.Ordinal);
        Assert.Contains("--force", printed.ToString(), StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(folder, ReportWriter.SummaryFileName)));
    }

    private static T[] Read<T>(string path)
    {
        using var reader = CsvReader.FromFile(path, null);
        return [.. reader.GetRecords<T>()];
    }

    // Our demo scenario: a reel of 10 k and 20 k 1 % parts (the simulator's seeded reel), sorted into 12 bands of
    // 0.1 % by the fixed-band assigner, stored as a sort session would store them.
    private static async Task<long> SortedSessionAsync(string db)
    {
        await using var bench = new SimulatedBench(
            new SimulatedBenchOptions
            {
                Seed = 3,
                TcpPort = 0,
                Reel = new ReelSpec { Count = 150 },
            }
        );
        await using var log = await PrecisionLogFactory.OpenAsync(db, null, default);
        var session = await log.OpenOrResumeSessionAsync(new SessionRequest("reel-7"), default);
        var number = 0;
        foreach (var reel in bench.Reel.GroupBy(p => p.NominalOhms))
        {
            var batch = await log.StartBatchAsync(
                session.Session.Id,
                new BatchSetup(
                    reel.Key,
                    10_000,
                    1_000,
                    reel.Key * 10 > 100_000 ? 1e6 : 1e5,
                    10,
                    true,
                    "simulator",
                    bench.Identity
                ),
                default
            );
            var cups = new BandCupAssigner(new BandCupOptions(12, 1_000, reel.Key, 1));
            foreach (var part in reel)
            {
                var measured = new MeasuredValue(part.OhmsAt23C, part.OhmsAt23C * 2e-6, part.OhmsAt23C * 1e-6);
                var cup = cups.Assign(new CupRequest(++number, reel.Key, measured)).CupLabel;
                await log.CommitPartAsync(
                    new PartCommit(
                        Guid.NewGuid(),
                        session.Session.Id,
                        batch.Id,
                        measured,
                        batch.Setup.Range,
                        10,
                        23,
                        DriftRuns.Start,
                        cup,
                        null,
                        []
                    ),
                    default
                );
            }
        }

        return session.Session.Id;
    }
}
