using SortRig.Engine.DriftLogging;
using SortRig.Simulator;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Physics;

namespace SortRig.Engine.Simulation;

/// <summary>
/// Our own demo scenario for the drift job: an instrument maker leaves 10 kOhm ladder resistors on the
/// scanner overnight in an unheated workshop (invented figures, not a reference): ambient 21 degC
/// swinging ±1.5 K over a day, tempco N(0, 25) ppm/K and ageing N(0, 0.5) ppm/h per part.
/// </summary>
public static class DriftDemoBench
{
    /// <summary>Simulator options with one reel part per drift channel and the Pt100 on the settings'
    /// channel.</summary>
    /// <exception cref="ArgumentException">A channel is outside 101..140, or the Pt100 channel does not follow the part
    /// channels.</exception>
    public static SimulatedBenchOptions For(DriftSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var bad = settings.Channels.FirstOrDefault(c => c is < 101 or > 140);
        if (bad != 0)
        {
            throw new ArgumentException(
                $"Drift.Channels: the simulator's part channels are 101..140; {bad} is not one.",
                nameof(settings)
            );
        }

        // Our own layout: part channels 101 up to the highest one asked, the Pt100 after them (0: the next channel).
        var partChannels = settings.Channels.Max() - 100;
        var pt100 = settings.Pt100Channel ?? 0;
        if (pt100 != 0 && (pt100 < 101 + partChannels || pt100 > 199))
        {
            throw new ArgumentException(
                $"Drift.Pt100Channel: on the simulator it must be {101 + partChannels}..199; was {pt100}.",
                nameof(settings)
            );
        }

        return new SimulatedBenchOptions
        {
            Seed = settings.Seed,
            TcpPort = 0,
            ScannerPartChannels = partChannels,
            Pt100Channel = pt100,
            Operator = new OperatorOptions { Mode = OperatorMode.Manual },
            Ambient = new AmbientSpec
            {
                MeanCelsius = 21,
                SwingKelvin = 1.5,
                Period = TimeSpan.FromHours(24),
            },
            Reel = new ReelSpec
            {
                Count = settings.Channels.Count,
                Nominals = [new NominalShare(10_000, 1)],
                TolerancePercent = 1,
                TempcoSigmaPpmPerKelvin = 25,
                DriftSigmaPpmPerHour = 0.5,
            },
        };
    }

    /// <summary>Loads reel part i onto the i-th drift channel, settled at ambient.</summary>
    public static void LoadParts(SimulatedBench bench, DriftSettings settings)
    {
        ArgumentNullException.ThrowIfNull(bench);
        ArgumentNullException.ThrowIfNull(settings);
        for (var i = 0; i < settings.Channels.Count; i++)
        {
            bench.Scanner.Load(settings.Channels[i], bench.Reel[i]);
        }
    }
}
