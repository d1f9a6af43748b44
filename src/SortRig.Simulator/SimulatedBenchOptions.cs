using SortRig.Simulator.Faults;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Physics;

namespace SortRig.Simulator;

/// <summary>Everything that shapes a simulated bench. Validated when the bench is built (see <see
/// cref="Validate"/>).</summary>
public sealed record SimulatedBenchOptions
{
    /// <summary>Seed of every random stream (reel, noise, bounce, operator, faults); 0 to 2^31-1. Default 1.</summary>
    public int Seed { get; init; } = 1;

    /// <summary>Serial number in the *IDN? reply; 1 to 32 printable characters without ',' or ';'. Default "SIM" + seed
    /// (6 digits).</summary>
    public string? SerialNumber { get; init; }

    /// <summary>The reel of parts. Default <see cref="ReelSpec"/>'s defaults (200 parts, 10k/20k, 1 %).</summary>
    public ReelSpec Reel { get; init; } = new();

    /// <summary>The room temperature. Default constant 23 degC.</summary>
    public AmbientSpec Ambient { get; init; } = new();

    /// <summary>The physics model (Simple or Rich) and the rich model's figures. Default Simple; see
    /// docs/simulator.md.</summary>
    public PhysicsSpec Physics { get; init; } = new();

    /// <summary>The virtual operator. Default auto mode, 1-3 s handling, 2-6 K warming, 60 s dwell.</summary>
    public OperatorOptions Operator { get; init; } = new();

    /// <summary>Random fault rates (default none) and fault timings.</summary>
    public FaultOptions Faults { get; init; } = new();

    /// <summary>How long contacts bounce after insertion; 0 to 1 s. Default 30 ms.</summary>
    public TimeSpan ContactBounce { get; init; } = TimeSpan.FromMilliseconds(30);

    /// <summary>Mains frequency that sets the NPLC aperture; 50 or 60 Hz. Default 50.</summary>
    public double LineFrequencyHz { get; init; } = 50;

    /// <summary>Lead and contact resistance added to 2-wire readings (not 4-wire), ohms; 0 to 10. Default 0.</summary>
    public double LeadResistanceOhms { get; init; }

    /// <summary>
    /// Half-width of each range's gain error, ppm of reading: every range gets its own error drawn once,
    /// uniform in ±this, from the seed (a stream of its own). 0 to 1000. Default 0 (an ideal meter); the sort
    /// verb's embedded bench uses 20 ppm, the 24 h % of reading figure of the simulator profile.
    /// </summary>
    public double RangeGainErrorPpm { get; init; }

    /// <summary>Number of scanner part channels (101 upwards); 0 to 40. Default 16 (101..116), our own
    /// layout.</summary>
    public int ScannerPartChannels { get; init; } = 16;

    /// <summary>
    /// The scanner channel wired to the Pt100; 0 (the default) for the channel right after the last part channel
    /// (117 with the default 16 part channels), else 101 to 199 and after the part channels.
    /// </summary>
    public int Pt100Channel { get; init; }

    /// <summary>The Pt100 channel in use: <see cref="Pt100Channel"/>, or 101 + part channels when that is 0.</summary>
    public int EffectivePt100Channel => Pt100Channel == 0 ? 101 + ScannerPartChannels : Pt100Channel;

    /// <summary>Standalone only: TCP port to serve on 127.0.0.1 (0 = any free port); null for none. Default
    /// 5025.</summary>
    public int? TcpPort { get; init; } = 5025;

    /// <summary>Standalone only: serial device path to serve on (e.g. /tmp/ttyA); null for none. Default
    /// null.</summary>
    public string? SerialPath { get; init; }

    /// <summary>Serial baud rate; 300 to 921600. Default 9600.</summary>
    public int SerialBaudRate { get; init; } = 9600;

    /// <summary>Standalone only: how much faster than real time the bench clock runs; above 0 to 10 000. Default
    /// 1.</summary>
    public double TimeScale { get; init; } = 1;

    /// <summary>The serial number used in *IDN?.</summary>
    public string EffectiveSerialNumber => SerialNumber ?? $"SIM{Seed:D6}";

    /// <summary>Throws naming the first invalid option and its valid range; returns this when valid.</summary>
    public SimulatedBenchOptions Validate()
    {
        OptionGuard.InRange(Seed, 0, int.MaxValue, "SimulatedBenchOptions.Seed");
        var serial = EffectiveSerialNumber;
        if (
            serial.Length is < 1 or > 32
            || serial.Any(c => c is ',' or ';' or '"' or '\'' || char.IsControl(c) || char.IsWhiteSpace(c))
        )
        {
            throw new ArgumentException(
                $"SimulatedBenchOptions.SerialNumber must be 1 to 32 printable characters without ',', ';', quotes "
                    + $"or spaces; was '{serial}'.",
                "SimulatedBenchOptions.SerialNumber"
            );
        }

        OptionGuard.NotNull(Reel, "SimulatedBenchOptions.Reel");
        OptionGuard.NotNull(Ambient, "SimulatedBenchOptions.Ambient");
        OptionGuard.NotNull(Operator, "SimulatedBenchOptions.Operator");
        OptionGuard.NotNull(Faults, "SimulatedBenchOptions.Faults");
        OptionGuard.NotNull(Physics, "SimulatedBenchOptions.Physics");
        Physics.Validate();
        Reel.Validate();
        Ambient.Validate();
        Operator.Validate();
        Faults.Validate();
        OptionGuard.InRange(
            ContactBounce,
            TimeSpan.Zero,
            TimeSpan.FromSeconds(1),
            "SimulatedBenchOptions.ContactBounce"
        );
        if (LineFrequencyHz is not (50 or 60))
        {
            throw new ArgumentOutOfRangeException(
                "SimulatedBenchOptions.LineFrequencyHz",
                LineFrequencyHz,
                "SimulatedBenchOptions.LineFrequencyHz must be 50 or 60."
            );
        }

        OptionGuard.InRange(LeadResistanceOhms, 0, 10, "SimulatedBenchOptions.LeadResistanceOhms", "ohm");
        OptionGuard.InRange(RangeGainErrorPpm, 0, 1000, "SimulatedBenchOptions.RangeGainErrorPpm", "ppm");
        OptionGuard.InRange(ScannerPartChannels, 0, 40, "SimulatedBenchOptions.ScannerPartChannels");
        OptionGuard.InRange(
            EffectivePt100Channel,
            101 + ScannerPartChannels,
            199,
            "SimulatedBenchOptions.Pt100Channel (0, or after the part channels)"
        );
        OptionGuard.InRange(TcpPort ?? 0, 0, 65535, "SimulatedBenchOptions.TcpPort");
        OptionGuard.InRange(SerialBaudRate, 300, 921_600, "SimulatedBenchOptions.SerialBaudRate");
        OptionGuard.InRange(TimeScale, 1e-3, 10_000, "SimulatedBenchOptions.TimeScale");
        return this;
    }
}
