using MathNet.Numerics.Distributions;
using MathNet.Numerics.Random;
using SortRig.Engine.Simulation;
using SortRig.Simulator;
using SortRig.Simulator.Meter;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Physics;

namespace SortRig.Bench.Settling;

/// <summary>
/// A reel on the simulated bench, inserted part after part into the front fixture on a virtual clock. Uses the
/// simulator in-process (its reel builder, fixture physics, contact bounce and meter conversion), not the SCPI
/// socket: the rule under test is judged on the same readings the socket would carry, without the transport.
/// Handling warmth is drawn U(WarmKelvinMin, WarmKelvinMax) as the virtual operator does; the meter's aperture
/// phase at contact is drawn U(0, 1). Truth is the value the part settles to on the range (with the rich model's
/// steady self-heating), at the ambient of the insertion.
/// </summary>
internal sealed class InsertionSource
{
    private static readonly TimeSpan s_partSpacing = TimeSpan.FromMinutes(1);
    private readonly SimulatedBench _bench;
    private readonly VirtualClock _clock;
    private readonly ContactBounce _bounce;
    private readonly MeterSettings _settings;
    private readonly Random _handling;
    private readonly TimeSpan _period;
    private readonly double _range;

    /// <param name="popcornShare">Share of parts with popcorn noise on the rich model; null: the simulator's default.
    /// Diagnosis only (settle-diag's no-popcorn): the draw that decides it is made either way, so every other noise
    /// stream is the same as in the default run.</param>
    public InsertionSource(
        ReelSpec reel,
        PhysicsModel physics,
        int seed,
        double range,
        double nplc,
        double? popcornShare = null
    )
    {
        _clock = new VirtualClock(new DateTimeOffset(2026, 1, 5, 8, 0, 0, TimeSpan.Zero));
        var options = new SimulatedBenchOptions
        {
            Seed = seed,
            Reel = reel,
            Physics = popcornShare is { } share
                ? new PhysicsSpec { Model = physics, PopcornShare = share }
                : new PhysicsSpec { Model = physics },
            Operator = new OperatorOptions { Mode = OperatorMode.Manual },
            TcpPort = null,
        };
        _bench = new SimulatedBench(options, _clock);
        _bounce = new ContactBounce(options.ContactBounce, SeedStreams.Derive(seed, SeedStreams.Bounce));
        _settings = MeterSettings.Default with
        {
            Function = MeterFunction.FourWireResistance,
            FourWire = new FunctionSettings(range, AutoRange: false, nplc),
        };
        _handling = new MersenneTwister(SeedStreams.Derive(seed, 101), threadSafe: false);
        _period = IntegrationTiming.Reading(nplc, autoZero: true, options.LineFrequencyHz);
        _range = range;
    }

    public int Count => _bench.Reel.Count;

    /// <summary>The reel's part at an index (diagnosis only: the rules never see it).</summary>
    public SimulatedPart Part(int index) => _bench.Reel[index];

    /// <summary>Inserts each part in turn (the previous one is removed first); readings are generated while it is
    /// in.</summary>
    public IEnumerable<Insertion> Insertions()
    {
        var engine = _bench.Device.Engine;
        var fixture = _bench.Fixture;
        var op = _bench.Options.Operator;
        for (var i = 0; i < _bench.Reel.Count; i++)
        {
            _clock.MoveTo(_bench.Epoch + (s_partSpacing * (i + 1)));
            fixture.Remove();
            var part = _bench.Reel[i];
            var warm = ContinuousUniform.Sample(_handling, op.WarmKelvinMin, op.WarmKelvinMax);
            var phase = _handling.NextDouble();
            fixture.Insert(part, warm);
            var at = fixture.InsertedAt!.Value;
            double Read(TimeSpan since) => engine.Convert(fixture.Sample(at + since, _bounce), _settings);
            double Presented(TimeSpan since) => fixture.Presented(at + since, _range);
            yield return new Insertion(
                i,
                warm,
                part.TempcoPpmPerKelvin,
                fixture.Settled(at, _range),
                at,
                _period,
                phase,
                _range,
                Read,
                Presented
            );
        }

        fixture.Remove();
    }
}
