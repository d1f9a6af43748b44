using MathNet.Numerics.Distributions;
using SortRig.Reporting.Reports;

namespace SortRig.Reporting.Tests;

/// <summary>Invented scenario data (an instrument maker sorting 1 % reels for R-2R ladders); not reference
/// data.</summary>
internal static class DemoData
{
    public static readonly DateTimeOffset Start = new(2025, 3, 1, 18, 0, 0, TimeSpan.FromHours(1));

    public static ReportPart[] Parts(
        int count,
        double nominal,
        double meanPpm,
        double sdPpm,
        int seed,
        int firstNumber = 1
    )
    {
        var normal = new Normal(meanPpm, sdPpm, new Random(seed));
        return Enumerable
            .Range(0, count)
            .Select(i =>
            {
                double ppm = normal.Sample();
                string cup =
                    ppm < -2000 ? "A"
                    : ppm < 0 ? "B"
                    : ppm < 2000 ? "C"
                    : "D";
                return new ReportPart(firstNumber + i, nominal, nominal * (1 + (ppm * 1e-6)), nominal * 5e-6, cup);
            })
            .ToArray();
    }

    /// <summary>One sample a minute; drift in ppm/h, tempco in ppm/K, temperature cycling 1 K every 3 h, white
    /// noise.</summary>
    public static ReportDriftSample[] Channel(
        string name,
        double ohms,
        int minutes,
        double driftPpmPerHour,
        double tempcoPpmPerK,
        double noisePpm,
        int seed,
        bool withTemperature = true
    )
    {
        var normal = new Normal(0, noisePpm, new Random(seed));
        return Enumerable
            .Range(0, minutes)
            .Select(i =>
            {
                double h = i / 60.0;
                double t = 22 + Math.Sin(2 * Math.PI * h / 3);
                double ppm = (driftPpmPerHour * h) + (tempcoPpmPerK * (t - 22)) + normal.Sample();
                return new ReportDriftSample(
                    Start.AddMinutes(i),
                    name,
                    ohms * (1 + (ppm * 1e-6)),
                    withTemperature ? t : null
                );
            })
            .ToArray();
    }
}
