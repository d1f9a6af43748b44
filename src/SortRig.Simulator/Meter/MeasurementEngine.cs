using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Meter;

/// <summary>
/// Takes one reading: waits the integration time on the bench clock, samples the routed input at
/// the end of the aperture, autoranges, then applies <see cref="ReadingModel"/>.
/// </summary>
internal sealed class MeasurementEngine
{
    private readonly BenchEnvironment _env;
    private readonly Fixture _fixture;
    private readonly Scanner _scanner;
    private readonly NoiseSource _noise;
    private readonly ContactBounce _bounce;
    private readonly MeterState _state;
    private readonly double _lineHz;
    private readonly double _leadOhms;
    private readonly RangeGains _gains;

    public MeasurementEngine(
        BenchEnvironment env,
        Fixture fixture,
        Scanner scanner,
        NoiseSource noise,
        ContactBounce bounce,
        MeterState state,
        double lineHz,
        double leadOhms,
        RangeGains gains
    )
    {
        (_env, _fixture, _scanner, _noise, _bounce, _state) = (env, fixture, scanner, noise, bounce, state);
        (_lineHz, _leadOhms, _gains) = (lineHz, leadOhms, gains);
    }

    /// <summary>The per-range gain errors (truth side).</summary>
    public RangeGains Gains => _gains;

    public DateTimeOffset Now => _env.Now;

    public TimeSpan ReadingDuration(MeterSettings settings) =>
        IntegrationTiming.Reading(settings.Active.Nplc, settings.AutoZero, _lineHz);

    /// <summary>
    /// One reading of the front fixture (channel null) or a scanner channel whose aperture ends at
    /// <paramref name="end"/>: waits until then on the bench clock and samples the input at exactly
    /// that instant, so that readings on a virtual clock do not depend on thread scheduling.
    /// Returns ohms or 9.9E37.
    /// </summary>
    public async Task<double> ReadAtAsync(
        int? channel,
        DateTimeOffset end,
        MeterSettings settings,
        CancellationToken ct
    )
    {
        await WaitUntilAsync(end, ct).ConfigureAwait(false);
        var input = channel is int c ? _scanner.Sample(c, end, _bounce) : _fixture.Sample(end, _bounce);
        return Convert(input, settings);
    }

    /// <summary>Waits until the bench clock reaches <paramref name="until"/>, in whole milliseconds (timer resolution),
    /// never early.</summary>
    public async Task WaitUntilAsync(DateTimeOffset until, CancellationToken ct)
    {
        var wait = until - _env.Now;
        if (wait > TimeSpan.Zero)
        {
            var wholeMs = TimeSpan.FromMilliseconds(Math.Ceiling(wait.TotalMilliseconds));
            await Task.Delay(wholeMs, _env.Time, ct).ConfigureAwait(false);
        }
    }

    /// <summary>Converts a sampled input with the given settings; draws exactly one noise value.</summary>
    public double Convert(InputSample input, MeterSettings settings)
    {
        var active = settings.Active;
        var current = active.AutoRange ? _state.Settings.For(settings.Function).Range : active.Range;
        var range = active.AutoRange ? ResistanceRanges.AutoSelect(current, input.Ohms, input.IsOpen) : active.Range;
        if (active.AutoRange && range != current)
        {
            _state.AutoRanged(settings.Function, range);
        }

        var lead = settings.Function == MeterFunction.Resistance ? _leadOhms : 0.0;
        var nplc = NplcSetting.Find(active.Nplc) ?? NplcSetting.Default;
        return ReadingModel.Report(
            input.IsOpen,
            SelfHeating.Apply(input, range),
            range,
            nplc,
            _noise.NextStandardNormal(),
            lead,
            _gains.Factor(range)
        );
    }
}
