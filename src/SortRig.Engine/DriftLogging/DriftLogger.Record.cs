using System.Globalization;
using System.Threading.Channels;
using SortRig.Engine.Events;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Temperature;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.DriftLogging;

/// <summary>Turns one good scan into stored samples: Pt100 to degC, temperature interpolated to each part
/// reading.</summary>
internal sealed partial class DriftLogger
{
    private double[]? _firstOhms;

    private async Task RecordAsync(
        IReadOnlyList<Reading> readings,
        ChannelWriter<DriftWrite> writer,
        CancellationToken ct
    )
    {
        var began = time.GetUtcNow();
        var finite = readings.Where(r => r.Kind == ReadingKind.Finite).Select(r => r.Time).ToList();
        if (_gap is { } gap && finite.Count > 0)
        {
            _gap = null;
            var to = finite.Min();
            await writer
                .WriteAsync(new DriftWrite(default, new DriftGap(_runId, gap.From, to, gap.Reason)), ct)
                .ConfigureAwait(false);
            hub.Publish(
                new BenchEvent(
                    0,
                    BenchEventKind.Notice,
                    default,
                    State: "drift-resumed",
                    Text: $"drift log: meter back; gap {gap.From:HH:mm:ss}..{to:HH:mm:ss} marked ({gap.Reason})"
                )
            );
        }

        var parts = settings.Channels.Count;
        var thermometer = settings.Pt100Channel is not null;
        (Reading Reading, double? Celsius)? before = thermometer
            ? (readings[0], ScanTemperature.Celsius(readings[0]))
            : null;
        (Reading Reading, double? Celsius)? after = thermometer
            ? (readings[^1], ScanTemperature.Celsius(readings[^1]))
            : null;
        _firstOhms ??= new double[parts];
        for (var i = 0; i < readings.Count; i++)
        {
            var reading = readings[i];
            if (reading.Kind != ReadingKind.Finite)
            {
                _overloads++;
                continue;
            }

            var isPt100 = thermometer && (i == 0 || i == readings.Count - 1);
            var channel = isPt100 ? parts : (thermometer ? i - 1 : i);
            var celsius = isPt100
                ? ScanTemperature.Celsius(reading)
                : ScanTemperature.Interpolate(before, after, reading.Time);
            await writer
                .WriteAsync(
                    new DriftWrite(new StoredDriftSample(_runId, channel, reading.Time, reading.Value, celsius), null),
                    ct
                )
                .ConfigureAwait(false);
            if (!isPt100)
            {
                Publish(channel, reading, celsius);
            }
        }

        _lastGood = finite.Count > 0 ? finite.Max() : _lastGood;
        _scans++;
        HeldBack(time.GetUtcNow() - began);
    }

    // The channel was full for half a scan interval or more: the store could not write (a lab server restarting, a
    // stalled link) and the scans due meanwhile were not taken. What was read waits in the channel and is written
    // when the store is back; the time without scans is marked as a gap, never left as a silent hole.
    private void HeldBack(TimeSpan waited)
    {
        // Half an interval: a wait that long already pushes the next scan a whole interval back (a skipped tick).
        if (waited <= settings.Interval / 2 || _gap is not null)
        {
            return;
        }

        _gap = (_lastGood, "storage unreachable: the sample buffer was full and scans were held back");
        Log.DriftHeldBack(logger, _runId, waited.TotalSeconds);
        hub.Publish(
            new BenchEvent(
                0,
                BenchEventKind.Notice,
                default,
                State: "drift-gap",
                Text: $"drift log: the database did not take samples for {waited.TotalSeconds:0} s; buffered samples "
                    + $"are written, the scans missed are marked as a gap from {_lastGood:HH:mm:ss}"
            )
        );
    }

    private void Publish(int channel, Reading reading, double? celsius)
    {
        var first = _firstOhms![channel];
        if (first == 0)
        {
            _firstOhms[channel] = first = reading.Value;
        }

        var label = DriftSettings.PartLabel(settings.Channels[channel]);
        var ppm = ((reading.Value / first) - 1) * 1e6;
        var temperature = celsius is { } c ? c.ToString(" 0.000 °C", CultureInfo.InvariantCulture) : "";
        hub.Publish(
            new BenchEvent(
                0,
                BenchEventKind.Drift,
                default,
                Value: reading.Value,
                DeviationPpm: ppm,
                State: label,
                Text: string.Create(
                    CultureInfo.InvariantCulture,
                    $"{label} {reading.Value:F4} Ω {ppm:+0.00;-0.00} ppm{temperature}"
                )
            )
        );
    }
}
