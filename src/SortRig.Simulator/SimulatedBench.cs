using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Simulator.Faults;
using SortRig.Simulator.Meter;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Physics;
using SortRig.Simulator.Scpi;
using SortRig.Simulator.Serving;

namespace SortRig.Simulator;

/// <summary>
/// A complete simulated bench: a 6½-digit resistance meter with a scanner, a fixture, a reel of
/// parts, the room, a virtual operator and a fault injector, served as a real SCPI device over TCP
/// and/or a serial line. Everything runs on the injected clock and is deterministic for a seed.
/// </summary>
public sealed partial class SimulatedBench : IAsyncDisposable
{
    private readonly CancellationTokenSource _lifetime = new();
    private readonly BenchEnvironment _env;
    private readonly ScpiDevice _device;
    private readonly ILoggerFactory _loggers;
    private readonly LooseParts _loose;
    private readonly Dictionary<double, SimulatedPart> _checkParts = [];

    /// <summary>Builds the bench; nothing runs until a Start method is called.</summary>
    /// <param name="options">Bench options; validated here (throws naming the bad option).</param>
    /// <param name="timeProvider">The bench clock; default <see cref="TimeProvider.System"/>. Use FakeTimeProvider in
    /// tests, <see cref="ScaledTimeProvider"/> to run fast.</param>
    /// <param name="loggerFactory">Logging; default none.</param>
    /// <param name="operatorTimeProvider">The virtual operator's clock; default the bench clock. A test driving a
    /// virtual clock gives the operator a view of its own, so that the driver tells the operator's waits from the
    /// meter's.</param>
    public SimulatedBench(
        SimulatedBenchOptions options,
        TimeProvider? timeProvider = null,
        ILoggerFactory? loggerFactory = null,
        TimeProvider? operatorTimeProvider = null
    )
    {
        ArgumentNullException.ThrowIfNull(options);
        Options = options.Validate();
        _loggers = loggerFactory ?? NullLoggerFactory.Instance;
        var physics = options.Physics;
        var wander = physics.IsRich
            ? new AmbientWander(physics.AmbientWanderKelvin, SeedStreams.Derive(options.Seed, SeedStreams.Wander))
            : null;
        _env = new BenchEnvironment(timeProvider ?? TimeProvider.System, options.Ambient, wander);
        Reel = PartThermal.Enrich(
            ReelBuilder.Build(options.Reel, SeedStreams.Derive(options.Seed, SeedStreams.Reel)),
            physics,
            SeedStreams.Derive(options.Seed, SeedStreams.Physics)
        );
        Fixture = new Fixture(_env, physics, SeedStreams.Derive(options.Seed, SeedStreams.Excess));
        _loose = new LooseParts(
            options.Reel,
            Reel.Count,
            SeedStreams.Derive(options.Seed, SeedStreams.LooseParts),
            physics
        );
        Scanner = new Scanner(_env, options.ScannerPartChannels, options.EffectivePt100Channel);
        Faults = new FaultInjector(options.Faults, SeedStreams.Derive(options.Seed, SeedStreams.Faults));
        Operator = new VirtualOperator(
            options.Operator,
            Reel,
            Fixture,
            operatorTimeProvider ?? _env.Time,
            SeedStreams.Derive(options.Seed, SeedStreams.Operator),
            _loggers.CreateLogger<VirtualOperator>()
        );
        var state = new MeterState();
        var engine = new MeasurementEngine(
            _env,
            Fixture,
            Scanner,
            new NoiseSource(SeedStreams.Derive(options.Seed, SeedStreams.Noise)),
            new ContactBounce(options.ContactBounce, SeedStreams.Derive(options.Seed, SeedStreams.Bounce)),
            state,
            options.LineFrequencyHz,
            options.LeadResistanceOhms,
            new RangeGains(options.RangeGainErrorPpm, SeedStreams.Derive(options.Seed, SeedStreams.Gain))
        );
        _device = new ScpiDevice(
            new DeviceContext
            {
                Identity = Identity,
                Environment = _env,
                State = state,
                Errors = new ErrorQueue(),
                Status = new StatusRegisters(),
                Engine = engine,
                Acquisition = new Acquisition(engine, state),
                Fixture = Fixture,
                Scanner = Scanner,
                Reel = Reel,
                Operator = Operator,
                Faults = Faults,
                Lifetime = _lifetime.Token,
            }
        );
    }

    /// <summary>The validated options.</summary>
    public SimulatedBenchOptions Options { get; }

    /// <summary>The *IDN? reply: "SortRig,SIM-6H,&lt;serial&gt;,1.0".</summary>
    public string Identity => $"SortRig,SIM-6H,{Options.EffectiveSerialNumber},1.0";

    /// <summary>The bench clock.</summary>
    public TimeProvider Time => _env.Time;

    /// <summary>When the bench was built (bench clock); true values and drift are referred to it.</summary>
    public DateTimeOffset Epoch => _env.Epoch;

    /// <summary>The reel, in the order the operator takes the parts.</summary>
    public IReadOnlyList<SimulatedPart> Reel { get; }

    /// <summary>The front fixture (test-side control).</summary>
    public Fixture Fixture { get; }

    /// <summary>The scanner card (test-side loading; routing is by SCPI).</summary>
    public Scanner Scanner { get; }

    /// <summary>The virtual operator.</summary>
    public VirtualOperator Operator { get; }

    /// <summary>The fault injector and its log.</summary>
    public FaultInjector Faults { get; }

    /// <summary>Ambient temperature now, in degC.</summary>
    public double AmbientCelsius => _env.AmbientAt(_env.Now);

    /// <summary>
    /// Test-only truth: the true resistance in ohms of reel part <paramref name="index"/> settled at the
    /// ambient now (no handling warmth), including its drift so far. Never for product logic.
    /// </summary>
    public double Truth(int index)
    {
        if (_loose.Find(index) is { } loose)
        {
            return _env.SettledOhms(loose, _env.Now);
        }

        OptionGuard.InRange(index, 0, Reel.Count - 1, nameof(index));
        return _env.SettledOhms(Reel[index], _env.Now);
    }

    /// <summary>
    /// Test-only truth: the gain error of a resistance range (full scale 100 to 1E7 ohms), ppm of reading,
    /// drawn from the seed within ±<see cref="SimulatedBenchOptions.RangeGainErrorPpm"/>; 0 for another value.
    /// </summary>
    public double GainErrorPpm(double range) => _device.Context.Engine.Gains.ErrorPpm(range);

    /// <summary>
    /// A part of the given nominal that is not on the reel (one kept from an earlier batch, say), drawn like a
    /// reel part from a seeded stream of its own. Loose parts are numbered after the reel (Reel.Count, +1, ...)
    /// and <see cref="Truth"/> knows them.
    /// </summary>
    /// <param name="nominalOhms">Marked value, ohms; finite, &gt; 0.</param>
    public SimulatedPart TakeLoosePart(double nominalOhms)
    {
        OptionGuard.InRange(nominalOhms, 1e-3, 1e9, nameof(nominalOhms), "ohm");
        return _loose.Take(nominalOhms);
    }

    /// <summary>
    /// Test hook, like the SCPI side channel SIMulation:GAIN:STEP: after <paramref name="afterConversions"/> more
    /// conversions every range reads <paramref name="ppm"/> ppm higher (the meter's gain steps); 0 clears it.
    /// </summary>
    /// <param name="ppm">Step, ppm of reading; within ±10 000.</param>
    /// <param name="afterConversions">Conversions before it takes effect; &gt;= 0.</param>
    public void StepGain(double ppm, long afterConversions = 0)
    {
        OptionGuard.InRange(ppm, -10_000, 10_000, nameof(ppm), "ppm");
        OptionGuard.InRange(afterConversions, 0, long.MaxValue, nameof(afterConversions));
        _device.Context.Engine.Gains.StepGain(ppm, afterConversions);
    }

    /// <summary>Test-only truth: the gain step in force now, ppm (see <see cref="StepGain"/>).</summary>
    public double GainStepPpm => _device.Context.Engine.Gains.StepPpm;

    /// <summary>
    /// The bench's check standard of the given nominal: one loose part drawn on first request and the same part
    /// every time after (the operator keeps it beside the fixture). <see cref="Truth"/> knows it by its index.
    /// </summary>
    /// <param name="nominalOhms">Marked value, ohms; finite, &gt; 0.</param>
    public SimulatedPart CheckPart(double nominalOhms)
    {
        OptionGuard.InRange(nominalOhms, 1e-3, 1e9, nameof(nominalOhms), "ohm");
        lock (_checkParts)
        {
            if (!_checkParts.TryGetValue(nominalOhms, out var part))
            {
                _checkParts[nominalOhms] = part = _loose.Take(nominalOhms);
            }

            return part;
        }
    }

    /// <summary>In-process SCPI (tests): runs one program message as a client would; returns the reply or
    /// null.</summary>
    internal Task<string?> ExecuteAsync(string message, CancellationToken ct = default) =>
        _device.ExecuteAsync(message, new ScpiSession(), null, ct);

    internal DeviceContext Device => _device.Context;
}
