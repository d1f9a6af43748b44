using System.Globalization;
using CsvHelper;
using Microsoft.Extensions.Time.Testing;
using SortRig.Measurement.Drift;
using SortRig.Reporting.Reports;

namespace SortRig.Reporting.Tests.Reports;

public sealed class ReportWriterTests : IDisposable
{
    private readonly string _folder = Path.Combine(
        Path.GetTempPath(),
        "sortrig-report-" + Guid.NewGuid().ToString("N")
    );
    private readonly FakeTimeProvider _time = new(new DateTimeOffset(2025, 3, 2, 7, 30, 0, TimeSpan.Zero));

    public void Dispose()
    {
        if (Directory.Exists(_folder))
        {
            Directory.Delete(_folder, recursive: true);
        }
    }

    private static ReportInput Input()
    {
        ReportPart[] parts =
        [
            .. DemoData.Parts(300, 10_000, -800, 2500, seed: 1),
            .. DemoData.Parts(120, 20_000, 1500, 3000, seed: 2, firstNumber: 301),
        ];
        ReportDriftSample[] drift =
        [
            .. DemoData.Channel("R-2R_MSB", 10_000, 480, 0.5, -3, 0.2, seed: 3),
            .. DemoData.Channel("ref 20k", 20_000, 480, -0.2, 0, 0.2, seed: 4, withTemperature: false),
        ];
        return new ReportInput("Ladder batch 7", parts, [new ReportReel(10_000, 1.0, [-2000, 0, 2000])], drift);
    }

    [Fact]
    public async Task WriteAsync_WritesPlotsCsvAndSummary()
    {
        var writer = new ReportWriter(_time, new ReportOptions(new SortRig.Reporting.Plots.PlotSize(800, 500)));

        ReportManifest manifest = await writer.WriteAsync(_folder, Input(), CancellationToken.None);

        string[] expected =
        [
            "histogram_10k.png",
            "histogram_20k.png",
            "drift_R-2R_MSB.png",
            "adev_R-2R_MSB.png",
            "drift_ref_20k.png",
            "adev_ref_20k.png",
            "parts.csv",
            "drift_samples.csv",
            "adev.csv",
            "summary.md",
        ];
        Assert.Equal(expected, manifest.Files);
        Assert.All(expected, f => Assert.True(File.Exists(Path.Combine(_folder, f)), f));
        foreach (string png in expected.Where(f => f.EndsWith(".png", StringComparison.Ordinal)))
        {
            PngFile.AssertImage(
                await File.ReadAllBytesAsync(Path.Combine(_folder, png), CancellationToken.None),
                800,
                500
            );
        }
    }

    [Fact]
    public async Task WriteAsync_SortingSessionOnly_NoEmptyDriftTablesNorEmptyCsvFiles()
    {
        var full = Input();
        var sortOnly = full with { DriftSamples = [] };

        ReportManifest manifest = await new ReportWriter(
            _time,
            new ReportOptions(new SortRig.Reporting.Plots.PlotSize(400, 300))
        ).WriteAsync(_folder, sortOnly, CancellationToken.None);

        Assert.Equal(["histogram_10k.png", "histogram_20k.png", "parts.csv", "summary.md"], manifest.Files);
        Assert.False(File.Exists(Path.Combine(_folder, "drift_samples.csv")));
        Assert.False(File.Exists(Path.Combine(_folder, "adev.csv")));
        string summary = await File.ReadAllTextAsync(Path.Combine(_folder, "summary.md"), CancellationToken.None);
        Assert.Contains("No drift run in this report", summary, StringComparison.Ordinal);
        Assert.DoesNotContain("## Drift", summary, StringComparison.Ordinal);
        Assert.DoesNotContain("Allan deviation (NIST SP 1065)", summary, StringComparison.Ordinal);
    }

    [Fact]
    public async Task WriteAsync_CsvFilesRoundTripWithCsvHelper()
    {
        ReportInput input = Input();
        ReportManifest manifest = await new ReportWriter(_time).WriteAsync(_folder, input, CancellationToken.None);

        PartCsvRow[] parts = Read<PartCsvRow>("parts.csv");
        Assert.Equal(input.Parts.Count, parts.Length);
        Assert.Equal(
            input.Parts.Select(p => (p.Number, p.NominalOhms, p.ValueOhms, p.StandardUncertaintyOhms, p.Cup)),
            parts.Select(r => (r.Number, r.NominalOhms, r.ValueOhms, r.StandardUncertaintyOhms, (string?)r.Cup))
        );
        Assert.All(parts, r => Assert.Equal(((r.ValueOhms / r.NominalOhms) - 1) * 1e6, r.DeviationPpm, 9));

        DriftCsvRow[] drift = Read<DriftCsvRow>("drift_samples.csv");
        Assert.Equal(input.DriftSamples.Select(s => new DriftCsvRow(s.Time, s.Channel, s.Ohms, s.TemperatureC)), drift);
        Assert.Equal(TimeSpan.FromHours(1), drift[0].Time.Offset);

        // ADEV rows equal an independent call of AllanDeviation on the channel's fractional deviations (tau0 = 60 s).
        ReportDriftSample[] msb = input.DriftSamples.Where(s => s.Channel == "R-2R_MSB").ToArray();
        double mean = msb.Average(s => s.Ohms);
        double[] y = msb.Select(s => (s.Ohms - mean) / mean).ToArray();
        IReadOnlyList<AllanPoint> expected = AllanDeviation.Overlapping(y, 60, AllanDeviation.OctaveFactors(y.Length));
        AdevCsvRow[] adev = Read<AdevCsvRow>("adev.csv").Where(r => r.Channel == "R-2R_MSB").ToArray();
        Assert.Equal(expected.Select(p => p.TauSeconds), adev.Select(r => r.TauSeconds));
        Assert.Equal(expected.Select(p => p.TermCount), adev.Select(r => r.Terms));
        Assert.All(expected.Zip(adev), pair => Assert.Equal(pair.First.Deviation * 1e6, pair.Second.AdevPpm, 12));
        Assert.Equal(expected, manifest.Channels.Single(c => c.Channel == "R-2R_MSB").Adev);
    }

    [Fact]
    public async Task WriteAsync_SummaryMentionsCountsStatisticsAndFits()
    {
        ReportInput input = Input();
        ReportManifest manifest = await new ReportWriter(_time).WriteAsync(_folder, input, CancellationToken.None);
        string md = await File.ReadAllTextAsync(manifest.SummaryPath, CancellationToken.None);

        Assert.Contains("# Ladder batch 7", md, StringComparison.Ordinal);
        Assert.Contains(
            "Generated 2025-03-02 07:30:00 UTC. 420 parts over 2 nominal values; 2 drift channels.",
            md,
            StringComparison.Ordinal
        );

        // Per-nominal mean and sample SD computed here without MathNet.
        double[] ppm10k = input
            .Parts.Where(p => p.NominalOhms == 10_000)
            .Select(p => ((p.ValueOhms / 10_000) - 1) * 1e6)
            .ToArray();
        double mean = ppm10k.Sum() / ppm10k.Length;
        double sd = Math.Sqrt(ppm10k.Sum(d => (d - mean) * (d - mean)) / (ppm10k.Length - 1));
        Assert.Contains(
            string.Create(CultureInfo.InvariantCulture, $"| 10k Ω | 300 | {mean:F1} | {sd:F1} |"),
            md,
            StringComparison.Ordinal
        );
        Assert.Contains("[histogram_10k.png](histogram_10k.png)", md, StringComparison.Ordinal);

        int cupA = input.Parts.Count(p => p.Cup == "A");
        Assert.Contains($"| A | {cupA} |", md, StringComparison.Ordinal);

        // Known synthetic drift +0.5 ppm/h and tempco -3 ppm/K come back within 4 standard errors.
        ChannelSummary msb = manifest.Channels.Single(c => c.Channel == "R-2R_MSB");
        Assert.NotNull(msb.Joint);
        Assert.InRange(
            msb.Joint.PpmPerHour.Value,
            0.5 - (4 * msb.Joint.PpmPerHour.StandardError),
            0.5 + (4 * msb.Joint.PpmPerHour.StandardError)
        );
        Assert.InRange(
            msb.Joint.PpmPerKelvin.Value,
            -3 - (4 * msb.Joint.PpmPerKelvin.StandardError),
            -3 + (4 * msb.Joint.PpmPerKelvin.StandardError)
        );
        Assert.Contains(
            string.Create(
                CultureInfo.InvariantCulture,
                $"{msb.Joint.PpmPerKelvin.Value:+0.000;-0.000} ± {msb.Joint.PpmPerKelvin.StandardError:0.000}"
            ),
            md,
            StringComparison.Ordinal
        );
        Assert.Contains("n/a (no temperature logged)", md, StringComparison.Ordinal);
        Assert.Contains("| R-2R_MSB | 60 |", md, StringComparison.Ordinal); // ADEV row at tau = 60 s
        Assert.Contains("[ADEV](adev_R-2R_MSB.png)", md, StringComparison.Ordinal);
    }

    [Fact]
    public async Task WriteAsync_PartsWithAcceptanceTimes_SummaryGivesThePaceAndTheRules()
    {
        var t0 = new DateTimeOffset(2025, 3, 2, 7, 0, 0, TimeSpan.Zero);
        ReportInput input = Input() with
        {
            Parts =
            [
                new ReportPart(1, 10_000, 10_000.4, 0.01, "A", t0, "Predictive"),
                new ReportPart(2, 10_000, 10_001.1, 0.01, "B", t0.AddSeconds(12.5), "Averaging"),
                new ReportPart(3, 10_000, 10_000.2, 0.01, "A", t0.AddSeconds(20), "Predictive"),
            ],
        };

        ReportManifest manifest = await new ReportWriter(_time).WriteAsync(_folder, input, CancellationToken.None);
        string md = await File.ReadAllTextAsync(manifest.SummaryPath, CancellationToken.None);

        // Arithmetic (common practice, no source): 3 acceptances over 20 s are 2 intervals, 10 s each; 3600 / 10 = 360.
        Assert.Contains(
            "Pace: 10.0 s per part, 360 parts per hour (first accepted part to last, 3 parts); settled by averaging "
                + "1, predictive 2.",
            md,
            StringComparison.Ordinal
        );
    }

    [Fact]
    public async Task WriteAsync_PartsWithoutTimes_NoPaceLine()
    {
        ReportManifest manifest = await new ReportWriter(_time).WriteAsync(_folder, Input(), CancellationToken.None);

        Assert.DoesNotContain(
            "Pace:",
            await File.ReadAllTextAsync(manifest.SummaryPath, CancellationToken.None),
            StringComparison.Ordinal
        );
    }

    [Fact]
    public async Task WriteAsync_BadPart_ThrowsNamingIndexPartAndField()
    {
        ReportInput input = Input() with
        {
            Parts = [new ReportPart(1, 100, 100.1, 0.001, null), new ReportPart(2, 100, double.NaN, 0.001, null)],
        };

        var ex = await Assert.ThrowsAsync<ArgumentException>(() =>
            new ReportWriter(_time).WriteAsync(_folder, input, CancellationToken.None)
        );

        Assert.Contains("Parts[1] (part 2).ValueOhms", ex.Message, StringComparison.Ordinal);
        Assert.False(Directory.Exists(_folder));
    }

    [Fact]
    public async Task WriteAsync_CallerCancelled_Throws()
    {
        using var cts = new CancellationTokenSource();
        await cts.CancelAsync();

        await Assert.ThrowsAnyAsync<OperationCanceledException>(() =>
            new ReportWriter(_time).WriteAsync(_folder, Input(), cts.Token)
        );
    }

    private T[] Read<T>(string file)
    {
        using CsvReader reader = CsvReader.FromFile(Path.Combine(_folder, file), null);
        return reader.GetRecords<T>().ToArray();
    }
}
