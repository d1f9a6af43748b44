using System.Globalization;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Instruments.Profiles;
using SortRig.Instruments.Scpi;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Specs;

namespace SortRig.Instruments.Drivers;

/// <summary>Drives a resistance meter over SCPI with the command templates of its profile. Owns the session.</summary>
internal sealed partial class ScpiResistanceMeter : IResistanceMeter, ITemperatureChannel
{
    private readonly ScpiSession _session;
    private readonly TimeProvider _time;
    private readonly ILogger _logger;
    private Applied? _applied;

    public ScpiResistanceMeter(
        ScpiSession session,
        MeterProfile profile,
        TimeProvider? time = null,
        ILogger? logger = null
    )
    {
        _session = session;
        Profile = profile;
        _time = time ?? TimeProvider.System;
        _logger = logger ?? NullLogger.Instance;
    }

    public MeterProfile Profile { get; }

    public bool HasTemperatureChannel => Commands.TemperatureChannel is not null;

    private MeterCommands Commands => Profile.Commands;

    public Task<InstrumentIdentity> IdentifyAsync(CancellationToken ct) => _session.IdentifyAsync(ct);

    public async Task ConfigureAsync(ResistanceSetup setup, CancellationToken ct)
    {
        var applied = Resolve(setup);
        var values = applied.Values;
        await _session.WriteAsync(Commands.Configure.Render(values), ct).ConfigureAwait(false);
        await _session.WriteAsync(Commands.Range.Render(values), ct).ConfigureAwait(false);
        if (Commands.Nplc is { } nplc)
        {
            await _session.WriteAsync(nplc.Render(values), ct).ConfigureAwait(false);
        }

        if (Commands.TriggerSource is { } trigger)
        {
            await _session.WriteAsync(trigger.Render(values), ct).ConfigureAwait(false);
        }

        await _session.CheckErrorsAsync(ct).ConfigureAwait(false);
        var (range, nplcBack) = await ReadBackAsync(applied, ct).ConfigureAwait(false);
        if (!MeterProfile.SameValue(range, applied.Range.FullScale))
        {
            throw new InstrumentSetupException("range", $"{Ohms(applied.Range.FullScale)} ohm", $"{Ohms(range)} ohm");
        }

        if (!MeterProfile.SameValue(nplcBack, applied.Nplc.Nplc))
        {
            throw new InstrumentSetupException("nplc", Ohms(applied.Nplc.Nplc), Ohms(nplcBack));
        }

        var rangeChanged = _applied is null || _applied.Range != applied.Range || _applied.Function != applied.Function;
        _applied = applied;
        Log.Configured(_logger, _session.Endpoint, applied.Function, applied.Range.FullScale, applied.Nplc.Nplc);
        if (rangeChanged && Profile.Spec.RangeChangeSettle > TimeSpan.Zero)
        {
            await Task.Delay(Profile.Spec.RangeChangeSettle, _time, ct).ConfigureAwait(false);
        }
    }

    public async Task<Reading> ReadAsync(CancellationToken ct)
    {
        var applied = _applied ?? throw new InvalidOperationException("ConfigureAsync must succeed before ReadAsync");
        var command = Commands.Read.Render(applied.Values);
        var number = await _session.QueryNumberAsync(command, ReadTimeout(applied, 1), ct).ConfigureAwait(false);
        return ToReading(number, applied.Range.FullScale, command, Ohms(number.Value));
    }

    public async Task<bool> VerifySetupAsync(CancellationToken ct)
    {
        if (_applied is not { } applied)
        {
            return false;
        }

        var (range, nplc) = await ReadBackAsync(applied, ct).ConfigureAwait(false);
        if (MeterProfile.SameValue(range, applied.Range.FullScale) && MeterProfile.SameValue(nplc, applied.Nplc.Nplc))
        {
            return true;
        }

        Log.SetupLost(_logger, _session.Endpoint, applied.Range.FullScale, applied.Nplc.Nplc, range, nplc);
        return false;
    }

    public async Task<Reading> ReadTemperatureAsync(int channel, CancellationToken ct)
    {
        var template = Commands.TemperatureChannel
            ?? throw new NotSupportedException($"profile '{Profile.Family}' has no temperature_channel template");
        var command = template.Render(("channel", channel));
        var number = await _session.QueryNumberAsync(command, ct).ConfigureAwait(false);
        return ToReading(number, 0, command, Ohms(number.Value));
    }

    public ValueTask DisposeAsync() => _session.DisposeAsync();

    private static string Ohms(double v) => v.ToString("G7", CultureInfo.InvariantCulture);

    private Reading ToReading(ScpiNumber number, double range, string command, string reply)
    {
        var now = _time.GetUtcNow();
        if (number.IsNotANumber)
        {
            throw new ScpiResponseException(command, reply, "a reading (9.91E37 is the SCPI not-a-number value)");
        }

        return number.IsOverflow || number.IsNegativeOverflow
            ? Reading.Overload(now, range)
            : Reading.Finite(number.Value, now, range);
    }

    private TimeSpan ReadTimeout(Applied applied, int readings) =>
        Profile.Comms.QueryTimeout + TimeSpan.FromSeconds(3.0 * readings / applied.Nplc.ReadingsPerSecond);

    private async Task<(double Range, double Nplc)> ReadBackAsync(Applied applied, CancellationToken ct)
    {
        var range = await _session
            .QueryNumberAsync(Commands.RangeQuery.Render(applied.Values), ct)
            .ConfigureAwait(false);
        var nplc = Commands.NplcQuery is { } query
            ? (await _session.QueryNumberAsync(query.Render(applied.Values), ct).ConfigureAwait(false)).Value
            : applied.Nplc.Nplc;
        return (range.Value, nplc);
    }

    private Applied Resolve(ResistanceSetup setup)
    {
        var range = Profile.FindRange(setup.Range)
            ?? throw new ArgumentOutOfRangeException(
                nameof(setup),
                setup.Range,
                $"range must be one of {string.Join(", ", Profile.Spec.Ranges.Select(r => Ohms(r.FullScale)))} ohm "
                    + $"(profile '{Profile.Family}')"
            );
        var nplc = Profile.FindNplc(setup.Nplc)
            ?? throw new ArgumentOutOfRangeException(
                nameof(setup),
                setup.Nplc,
                $"NPLC must be one of {string.Join(", ", Profile.Spec.Nplcs.Select(n => Ohms(n.Nplc)))} (profile '"
                    + $"{Profile.Family}')"
            );
        var function = setup.FourWire ? Commands.Function4Wire : Commands.Function2Wire;
        return function is null
            ? throw new ArgumentOutOfRangeException(
                nameof(setup),
                setup.FourWire,
                $"profile '{Profile.Family}' has no {(setup.FourWire ? "4" : "2")}-wire resistance"
            )
            : new Applied(function, range, nplc);
    }

    /// <summary>A setup resolved against the profile, with its template values.</summary>
    private sealed record Applied(string Function, RangeSpec Range, NplcSpec Nplc)
    {
        public (string, object)[] Values =>
            [("function", Function), ("range", Range.FullScale), ("nplc", Nplc.Nplc), ("source", "IMM")];

        public (string, object)[] With(string name, object value) => [.. Values, (name, value)];
    }
}
