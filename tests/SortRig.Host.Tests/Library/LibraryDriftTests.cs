using System.Globalization;
using CsvHelper;
using MathNet.Numerics;
using SortRig.Host.Cli;
using SortRig.Host.LibraryVerb;
using SortRig.Host.VerbSupport;
using SortRig.Storage.Contracts;

namespace SortRig.Host.Tests.Library;

/// <summary>
/// The drift record of library parts in `library export` and `library find`, on real stores. Invented bench scenario:
/// four 10 kOhm ladder parts; two overnight runs whose samples follow exact lines chosen here (synthetic, not data).
/// </summary>
public sealed class LibraryDriftTests
{
    private const double DriftA = 0.8; // ppm/h, part A in night-1
    private const double TempcoA = -12; // ppm/K, part A in night-1
    private const double DriftB1 = 5; // ppm/h, part B in night-1 (superseded)
    private const double DriftB2 = -2.5; // ppm/h, part B in night-2, no thermometer

    [Theory]
    [InlineData(StoreEngine.Sqlite)]
    [PostgresData]
    public async Task Export_PartsWithDriftRuns_CarryTheLatestRunsFitAndOthersEmptyFields(StoreEngine engine)
    {
        await using var store = await TestStore.CreateAsync(engine);
        var (a, b, never, noSamples) = await SeedAsync(store);
        var file = store.File("library.csv");

        var code = await LibraryExport.RunAsync(
            store.Database,
            file,
            null,
            null,
            new ConsoleCapture().Console,
            TextWriter.Null,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        var rows = ReadRows(file, out var headers);
        Assert.Equal(LibraryExport.Columns, headers);
        Assert.Equal(4, rows.Count);

        // Part A: ppm = 0.8 h - 12 (T - 22), T symmetric in time, so time and temperature are orthogonal and both
        // least-squares slopes are exactly the line's (definition of least squares). The ppm refer to the channel mean,
        // not to 10 kOhm, which scales the slopes by 10 kOhm / mean (a few ppm): hence the 1e-5 relative tolerance.
        var rowA = rows[a.Id];
        Assert.Equal(("night-1", 4.0), (rowA["drift_run"], D(rowA["drift_hours"])));
        Assert.Equal(DriftA, D(rowA["drift_ppm_h"]), DriftA * 1e-5);
        Assert.Equal(TempcoA, D(rowA["tempco_ppm_k"]), Math.Abs(TempcoA) * 1e-5);

        // Least squares, MathNet Fit.Line as reference: the same samples as ppm of their mean against hours.
        var (hours, ohms) = NightOneA();
        var mean = ohms.Average();
        var reference = Fit.Line(hours, [.. ohms.Select(r => ((r / mean) - 1) * 1e6)]);
        Assert.Equal(reference.B, D(rowA["drift_ppm_h"]), 1e-9);

        // Part B was logged twice: the later run (night-2, no temperatures) is shown, so its tempco is empty.
        var rowB = rows[b.Id];
        Assert.Equal(("night-2", 3.0, ""), (rowB["drift_run"], D(rowB["drift_hours"]), rowB["tempco_ppm_k"]));
        Assert.Equal(DriftB2, D(rowB["drift_ppm_h"]), Math.Abs(DriftB2) * 1e-5);

        // NIST SP 1065 (Riley 2008), Allan deviation of a linear frequency drift D: sigma_y(tau) = D tau / sqrt(2)
        // (from memory; it follows from the overlapping estimator, every second difference being D tau).
        var tau = D(rowB["adev_tau_s"]);
        Assert.True(tau >= 60 && double.IsPow2((long)(tau / 60)), $"tau {tau} s is not an octave of the 60 s interval");
        Assert.Equal(
            Math.Abs(DriftB2) / 3600 * tau / Math.Sqrt(2),
            D(rowB["adev_ppm"]),
            Math.Abs(DriftB2) / 3600 * tau * 1e-5
        );

        // Never logged, or logged on a channel that never got a sample: every drift field empty.
        string[] driftColumns = [.. LibraryExport.Columns.Skip(20)];
        Assert.Equal(7, driftColumns.Length);
        Assert.All(driftColumns, c => Assert.Equal(("", ""), (rows[never.Id][c], rows[noSamples.Id][c])));
    }

    [Fact]
    public async Task Find_Table_ShowsEachPartsLatestDriftRateOrADash()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        var (a, b, never, _) = await SeedAsync(store);
        var io = new ConsoleCapture();

        var code = await LibraryFind.RunAsync(
            new FindRequest(store.Database, "10k", null, null),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        var lines = io.Text.Split('\n');
        string Row(PartRecord p) =>
            lines.Single(l =>
                l.TrimStart().StartsWith(p.Id.ToString(CultureInfo.InvariantCulture) + " ", StringComparison.Ordinal)
            );
        // Two significant digits of the lines' slopes (0.8 and -2.5 ppm/h, chosen above); common practice, no source.
        Assert.EndsWith("+0.80 ppm/h", Row(a).TrimEnd(), StringComparison.Ordinal);
        Assert.EndsWith("-2.5 ppm/h", Row(b).TrimEnd(), StringComparison.Ordinal);
        Assert.EndsWith("—", Row(never).TrimEnd(), StringComparison.Ordinal);
    }

    private static double D(string field) => double.Parse(field, NumberStyles.Float, CultureInfo.InvariantCulture);

    private static Dictionary<long, Dictionary<string, string>> ReadRows(string file, out string[] headers)
    {
        using var reader = CsvReader.FromFile(file, null);
        var rows = new Dictionary<long, Dictionary<string, string>>();
        while (reader.Read())
        {
            var row = LibraryExport.Columns.ToDictionary(c => c, c => reader.GetString(c) ?? "");
            rows[long.Parse(row["id"], CultureInfo.InvariantCulture)] = row;
        }

        headers = [.. reader.Headers!];
        return rows;
    }

    /// <summary>Night-1, part A: 241 samples 60 s apart (4 h); T = 22 + 1.5 cos(2 pi k / 240) degC, symmetric in
    /// time.</summary>
    private static (double[] Hours, double[] Ohms) NightOneA()
    {
        var hours = Enumerable.Range(0, 241).Select(k => k / 60.0).ToArray();
        return (
            hours,
            [.. hours.Select((h, k) => 10_000 * (1 + (((DriftA * h) + (TempcoA * (Temp(k) - 22))) * 1e-6)))]
        );
    }

    private static double Temp(int k) => 22 + (1.5 * Math.Cos(2 * Math.PI * k / 240));

    private static async Task<(PartRecord A, PartRecord B, PartRecord Never, PartRecord NoSamples)> SeedAsync(
        TestStore store
    )
    {
        await using var log = await store.OpenAsync();
        var p = await Seed.SessionAsync(
            log,
            "ladder",
            [
                new SeedPart(-40, 10, Slot: "T1-A01"),
                new SeedPart(15, 10, Slot: "T1-A02"),
                new SeedPart(60, 10, Slot: "T1-A03"),
                new SeedPart(-5, 10, Slot: "T1-A04"),
            ]
        );
        var t0 = new DateTimeOffset(2026, 3, 2, 20, 0, 0, TimeSpan.Zero);
        var night1 = await log.StartDriftRunAsync(
            new DriftRunRequest(
                "night-1",
                [new DriftChannel("ch101", p[0].Id), new DriftChannel("ch102", p[1].Id), new DriftChannel("pt100@103")],
                TimeSpan.FromMinutes(1)
            ),
            CancellationToken.None
        );
        var (hours, ohmsA) = NightOneA();
        var samples = new List<StoredDriftSample>();
        for (var k = 0; k < hours.Length; k++)
        {
            var at = t0.AddMinutes(k);
            samples.Add(new StoredDriftSample(night1.Id, 0, at, ohmsA[k], Temp(k)));
            samples.Add(new StoredDriftSample(night1.Id, 1, at, 10_000 * (1 + (DriftB1 * hours[k] * 1e-6)), Temp(k)));
            // Thermometer channel, filler: a Pt100 read as R0 (1 + A T) with IEC 60751's A = 3.9083e-3 /K (from
            // memory); only its presence in the run matters to these tests.
            samples.Add(new StoredDriftSample(night1.Id, 2, at, 100 * (1 + (3.9083e-3 * (Temp(k) - 0))), null));
        }

        await log.AppendDriftSamplesAsync(samples, CancellationToken.None);
        var night2 = await log.StartDriftRunAsync(
            new DriftRunRequest(
                "night-2",
                [new DriftChannel("ch101", p[1].Id), new DriftChannel("ch102", p[3].Id)],
                TimeSpan.FromMinutes(1)
            ),
            CancellationToken.None
        );
        var t1 = t0.AddDays(1);
        await log.AppendDriftSamplesAsync(
            [
                .. Enumerable
                    .Range(0, 181)
                    .Select(k => new StoredDriftSample(
                        night2.Id,
                        0,
                        t1.AddMinutes(k),
                        10_000 * (1 + (DriftB2 * (k / 60.0) * 1e-6)),
                        null
                    )),
            ],
            CancellationToken.None
        );
        return (p[0], p[1], p[2], p[3]);
    }
}
