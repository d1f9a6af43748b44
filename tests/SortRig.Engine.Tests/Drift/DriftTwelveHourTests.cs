using SortRig.Engine.DriftLogging;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Drift;

/// <summary>
/// A 12-hour drift log of four parts every 10 s in virtual time, on the embedded simulator over a real TCP
/// socket into a real SQLite file. The simulator's hidden truth (its ambient model and each part's drift and
/// tempco) is the outside reference; the memory figures are reported by bench/SortRig.Bench (drift).
/// </summary>
public sealed class DriftTwelveHourTests : IDisposable
{
    // A real SQLite file on tmpfs when there is one: the run commits ~700 transactions with fsync (synchronous=FULL),
    // which on a shared disk would dominate the test's time without testing anything more.
    private readonly string _dir = Directory.Exists("/dev/shm")
        ? Directory.CreateDirectory(Path.Combine("/dev/shm", "sortrig-drift-" + Guid.NewGuid().ToString("N"))).FullName
        : Directory.CreateTempSubdirectory("sortrig-drift-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task TwelveHourRun_EverySampleOnce_TemperatureDriftAndTempcoMatchTheSimulator()
    {
        var db = Path.Combine(_dir, "night.db");
        var settings = new DriftOptions
        {
            Database = db,
            Run = "night",
            Channels = "101-104",
            IntervalSeconds = 10,
            Hours = 12.1,
            Seed = 11,
        }.Validate();
        var memory = new SortedDictionary<int, long>();
        int[] checkpoints = [1, 6, 12];

        var (outcome, bench) = await DriftRuns.RunAsync(settings, (_, next) =>
        {
            foreach (var h in checkpoints.Where(h => !memory.ContainsKey(h) && next >= DriftRuns.Start.AddHours(h)))
            {
                memory[h] = GC.GetTotalMemory(forceFullCollection: true);
            }
        });

        // Every scan time of the 12.1 h at 10 s was scanned once, and every reading of it stored once:
        // 4 parts + the Pt100 before and after the parts.
        const int scans = 4356;
        Assert.Equal(scans, outcome.Scans);
        Assert.Equal(0, outcome.SkippedTicks);
        Assert.True(
            outcome.Gaps == 0,
            string.Join(
                "\n",
                (await DriftRuns.GapsAsync(db, outcome.RunId)).Select(g => $"{g.From:O}..{g.To:O} {g.Reason}")
            )
        );
        var samples = await DriftRuns.SamplesAsync(db, outcome.RunId);
        Assert.Equal(scans * 6, samples.Count);
        Assert.Equal(samples.Count, outcome.SamplesStored);
        for (var channel = 0; channel < 4; channel++)
        {
            var times = samples.Where(s => s.Channel == channel).Select(s => s.Time).ToList();
            Assert.Equal(scans, times.Count);
            Assert.All(times.Zip(times.Skip(1)), p => Assert.Equal(10.0, (p.Second - p.First).TotalSeconds, 0.05));
        }

        // Pt100 by Callendar-Van Dusen (IEC 60751) against the simulator's ambient model at each sample's time;
        // the parts' temperatures are interpolated between the two Pt100 readings of their scan.
        var ambient = bench.Options.Ambient;
        var worst = samples.Max(s => Math.Abs(s.Temperature!.Value - ambient.CelsiusAt(s.Time - bench.Epoch)));
        Assert.True(worst < 0.05, $"worst temperature error {worst:F4} K");

        // Drift (ppm/h) and tempco (ppm/K) of each part from the joint fit, against the part's hidden truth.
        for (var i = 0; i < 4; i++)
        {
            var part = bench.Scanner.Occupant(settings.Channels[i])!;
            var fit = outcome.Channels[i].Joint!;
            Assert.Equal(4356, outcome.Channels[i].Count);
            Assert.True(
                Math.Abs(fit.PpmPerHour.Value - part.DriftPpmPerHour) <= 4 * fit.PpmPerHour.StandardError,
                $"ch{settings.Channels[i]} drift {fit.PpmPerHour} vs true {part.DriftPpmPerHour}"
            );
            Assert.True(
                Math.Abs(fit.PpmPerKelvin.Value - part.TempcoPpmPerKelvin) <= 4 * fit.PpmPerKelvin.StandardError,
                $"ch{settings.Channels[i]} tempco {fit.PpmPerKelvin} vs true {part.TempcoPpmPerKelvin}"
            );
        }

        // Memory stays flat however long the run: the loose bound here; the figures are in docs/bench-drift.md.
        Assert.Equal(checkpoints, memory.Keys);
        var growth = memory[12] - memory[1];
        Assert.True(
            growth < 4 << 20,
            $"managed memory grew {growth / 1024.0:F0} KiB from 1 h to 12 h ({string.Join(", ", memory)})"
        );
    }
}
