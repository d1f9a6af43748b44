using Microsoft.Extensions.Time.Testing;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Tests.Support;

/// <summary>Bench set-ups shared by tests: manual operator, simple reels.</summary>
internal static class Benches
{
    public static readonly DateTimeOffset Start = new(2025, 3, 1, 20, 0, 0, TimeSpan.Zero);

    public static FakeTimeProvider FakeClock() => new(Start);

    public static SimulatedBenchOptions Manual(ReelSpec? reel = null, int seed = 7) =>
        new()
        {
            Seed = seed,
            Reel = reel
                ?? new ReelSpec
                {
                    Count = 20,
                    Nominals = [new(10_000, 1)],
                    TolerancePercent = 1,
                },
            Operator = new OperatorOptions { Mode = OperatorMode.Manual },
            TcpPort = 0,
        };

    /// <summary>A reel of one nominal with a fixed tempco and time constant (no spread).</summary>
    public static ReelSpec SingleNominal(double ohms, int count = 10, double tempco = 0, double tolerancePercent = 1) =>
        new()
        {
            Count = count,
            Nominals = [new(ohms, 1)],
            TolerancePercent = tolerancePercent,
            TempcoMeanPpmPerKelvin = tempco,
            TempcoSigmaPpmPerKelvin = 0,
            ThermalTimeConstantSpread = 0,
        };
}
