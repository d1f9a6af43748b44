using System.Globalization;
using CsvHelper;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using SortRig.Engine.DriftLogging;
using SortRig.Engine.Events;
using SortRig.Engine.Simulation;
using SortRig.Host.Hosting;
using SortRig.Host.LibraryVerb;
using SortRig.Host.Tests.Library;
using SortRig.Host.VerbSupport;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;

namespace SortRig.Host.Tests.Drift;

/// <summary>
/// Library parts put on scanner channels with --library-parts: a 12 h run every 120 s in virtual time on the embedded
/// simulator (real TCP socket) into a real SQLite file that holds the library, then the library's view of the run.
/// Invented scenario: four 10 kOhm ladder parts from one sorting session; the simulator's hidden truth is the
/// reference.
/// </summary>
public sealed class DriftLibraryPartsTests
{
    [Fact]
    public async Task Run_WithLibraryParts_EachPartCarriesItsChannelsRecordInStorageAndExport()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        var p = await Seed.SessionAsync(
            store,
            "ladder",
            [new SeedPart(-40, 10), new SeedPart(15, 10), new SeedPart(60, 10), new SeedPart(-5, 10)]
        );
        // Shuffled onto the channels (the label form "#id" for one), channel 104 logged without a library part, p[3]
        // never logged.
        var settings = new DriftOptions
        {
            Database = store.Database,
            Run = "ladder-night",
            Channels = "101-104",
            IntervalSeconds = 120,
            Hours = 12,
            Seed = 11,
            LibraryParts = $"101={p[2].Id},102=#{p[0].Id},103={p[1].Id}",
        }.Validate();
        var onChannel = new[] { p[2], p[0], p[1] };

        var (outcome, bench) = await DriftRuns.RunAsync(settings);

        // 12 h / 120 s = 360 scan times, each scanned and stored once (arithmetic of the settings).
        Assert.Equal((360, 0, 0L), (outcome.Scans, outcome.Gaps, outcome.SkippedTicks));
        await using (var log = await store.OpenAsync())
        {
            var stored = await log.GetDriftRunAsync(outcome.RunId, CancellationToken.None);
            Assert.Equal([p[2].Id, p[0].Id, p[1].Id, null, null], stored!.Channels.Select(c => c.PartId));
            Assert.Equal(["ch101", "ch102", "ch103", "ch104", "pt100@105"], stored.Channels.Select(c => c.Label));

            var rows = await log.GetPartDriftRunsAsync([.. p.Select(x => x.Id)], CancellationToken.None);
            Assert.Equal(3, rows.Count);
            for (var i = 0; i < 3; i++)
            {
                var row = Assert.Single(rows, r => r.PartId == onChannel[i].Id);
                Assert.Equal(
                    (outcome.RunId, "ladder-night", i, $"ch{101 + i}", 360L),
                    (row.RunId, row.RunName, row.Channel, row.ChannelLabel, row.SampleCount)
                );
            }
        }

        var file = store.File("library.csv");
        Assert.Equal(
            VerbExit.Ok,
            await LibraryExport.RunAsync(
                store.Database,
                file,
                null,
                null,
                new ConsoleCapture().Console,
                TextWriter.Null,
                CancellationToken.None
            )
        );
        var export = ReadRows(file);
        for (var i = 0; i < 3; i++)
        {
            var row = export[onChannel[i].Id];
            var truth = bench.Scanner.Occupant(settings.Channels[i])!;
            var fit = outcome.Channels[i].Joint;
            Assert.True(fit is not null, $"ch{settings.Channels[i]}: {outcome.Channels[i].JointNote}");
            // First to last sample: 359 intervals of 120 s (arithmetic of the settings).
            Assert.Equal(
                (outcome.RunId.ToString(CultureInfo.InvariantCulture), "ladder-night"),
                (row["drift_run_id"], row["drift_run"])
            );
            Assert.Equal(359 * 120 / 3600.0, D(row["drift_hours"]), 1e-9);
            // The part's tempco is its own channel's: the simulator's truth for the part loaded there, within 4
            // standard errors.
            Assert.True(
                Math.Abs(D(row["tempco_ppm_k"]) - truth.TempcoPpmPerKelvin) <= 4 * fit.PpmPerKelvin.StandardError,
                $"part {onChannel[i].Id} on ch{settings.Channels[i]}: tempco {row["tempco_ppm_k"]} vs true "
                    + $"{truth.TempcoPpmPerKelvin} ± {fit.PpmPerKelvin.StandardError}"
            );
        }

        // The part left off the scanner has no drift record.
        Assert.Equal(("", ""), (export[p[3].Id]["drift_run_id"], export[p[3].Id]["drift_ppm_h"]));
    }

    [Theory]
    [InlineData("101={unknown}", "item '101={unknown}': no part has this id")]
    [InlineData("102={retired}", "item '102={retired}': the part is retired")]
    [InlineData("101={0},105={1}", "item '105={1}': channel 105 is not in the scan list")]
    [InlineData("101={0},103=#{0}", "item '103=#{0}': part {0} is already on channel 101")]
    public async Task Run_BadLibraryParts_NamesTheOptionAndItem_ExitsBadInput_LogsNoRun(string mapping, string said)
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        var p = await Seed.SessionAsync(
            store,
            "ladder",
            [new SeedPart(-40, 10), new SeedPart(15, 10), new SeedPart(60, 10)]
        );
        await using (var log = await store.OpenAsync())
        {
            Assert.True((await log.RetireAsync([p[2].Id], "cracked end cap", CancellationToken.None)).Succeeded);
        }

        string Fill(string s) =>
            s.Replace("{0}", $"{p[0].Id}", StringComparison.Ordinal)
                .Replace("{1}", $"{p[1].Id}", StringComparison.Ordinal)
                .Replace("{retired}", $"{p[2].Id}", StringComparison.Ordinal)
                .Replace("{unknown}", "999", StringComparison.Ordinal);
        var options = new DriftOptions
        {
            Database = store.Database,
            Channels = "101-104",
            IntervalSeconds = 60,
            Hours = 1,
            LibraryParts = Fill(mapping),
        };

        // The message: from the settings check (syntax, scan list) or from the library check before the run.
        var e = await Assert.ThrowsAsync<ArgumentException>(() => DriftRuns.RunAsync(options.Validate()));
        Assert.StartsWith("Drift.LibraryParts (--library-parts): ", e.Message, StringComparison.Ordinal);
        Assert.Contains(Fill(said), e.Message, StringComparison.Ordinal);

        // The hosted form (what the verb runs) exits with the verbs' bad-input code.
        var clock = new VirtualClock(DriftRuns.Start);
        using var lifetime = new StopOnlyLifetime();
        using var worker = new DriftWorker(
            Options.Create(options),
            clock,
            new BenchEventHub(clock),
            NullLoggerFactory.Instance,
            lifetime
        );
        await worker.StartAsync(CancellationToken.None);
        await worker.ExecuteTask!.WaitAsync(TimeSpan.FromMinutes(1));
        Assert.Equal(VerbExit.BadInput, worker.ExitCode);
        Assert.True(lifetime.Stopped);

        await using (var log = await store.OpenAsync())
        {
            Assert.Null(await log.GetDriftRunAsync(1, CancellationToken.None));
            Assert.Empty(await log.GetPartDriftRunsAsync(null, CancellationToken.None));
        }
    }

    private static double D(string field) => double.Parse(field, NumberStyles.Float, CultureInfo.InvariantCulture);

    private static Dictionary<long, Dictionary<string, string>> ReadRows(string file)
    {
        using var reader = CsvReader.FromFile(file, null);
        var rows = new Dictionary<long, Dictionary<string, string>>();
        while (reader.Read())
        {
            var row = LibraryExport.Columns.ToDictionary(c => c, c => reader.GetString(c) ?? "");
            rows[long.Parse(row["id"], CultureInfo.InvariantCulture)] = row;
        }

        return rows;
    }
}
