using System.Globalization;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Meter;

public sealed class NoiseTests
{
    // Our documented noise and resolution table (docs/simulator.md), ppm of range: NPLC -> (noise, step).
    private static readonly (double Nplc, double NoisePpm, double StepPpm)[] s_table =
    [
        (0.04, 12, 40),
        (0.4, 2, 4),
        (1, 0.7, 1),
        (4, 0.35, 0.5),
        (10, 0.25, 0.2),
        (40, 0.15, 0.1),
    ];

    [Fact]
    public async Task Rms_FallsWithNplc_AndMatchesDocumentedNoiseWhereStepIsFine()
    {
        var clock = Benches.FakeClock();
        await using var bench = new SimulatedBench(Benches.Manual(Benches.SingleNominal(10_000)), clock);
        bench.Fixture.Insert(bench.Reel[0]);
        clock.Advance(TimeSpan.FromSeconds(1)); // past contact bounce
        var rmsPpm = new List<double>();
        foreach (var (nplc, noise, step) in s_table)
        {
            await bench.ExecuteAsync(
                string.Create(CultureInfo.InvariantCulture, $"CONF:RES 10000;:RES:NPLC {nplc};:SAMP:COUN 1000")
            );
            var readingTime = TimeSpan.FromSeconds((nplc / 50 * 2) + 0.001);
            var reply = await VirtualTime.RunAsync(clock, bench.ExecuteAsync("READ?"), readingTime);
            var rms = Numbers.RmsAboutMean(Numbers.ParseList(reply!)) / 10_000 * 1e6;
            rmsPpm.Add(rms);
            if (step <= 2 * noise)
            {
                // Quantised Gaussian: variance adds step^2/12 (Sheppard's correction; Widrow & Kollar,
                // Quantization Noise, 2008, ch. 5, from memory). 1000 readings: s within about 10 % (3 sigma).
                var expected = Math.Sqrt((noise * noise) + (step * step / 12));
                Assert.InRange(rms, expected * 0.88, expected * 1.12);
            }
        }

        Assert.True(
            rmsPpm.Zip(rmsPpm.Skip(1)).All(p => p.First > p.Second),
            "RMS must fall with NPLC: " + string.Join(", ", rmsPpm)
        );
    }
}
