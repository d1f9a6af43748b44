using System.Globalization;
using System.Threading.Channels;
using SortRig.Engine.Events;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Temperature;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.DriftLogging;

/// <summary>Turns one good scan into stored samples: Pt100 to degC, temperature interpolated to each part reading.</summary>
internal sealed partial class DriftLogger
{
    private double[]? _firstOhms;

    private async Task RecordAsync(IReadOnlyList<Reading> readings, ChannelWriter<DriftWrite> writer, CancellationToken ct)
    {
        var finite = readings.Where(r => r.Kind == ReadingKind.Finite).Select(r => r.Time).ToList();
        if (_gap is { } gap && finite.Count > 0)
        {
            _gap = null;
            var to = finite.Min();
            await writer.WriteAsync(new DriftWrite(default, new DriftGap(_runId, gap.From, to, gap.Reason)), ct).ConfigureAwait(false);
            hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default, State: "drift-resumed",
                Text: $"drift log: meter back; gap {gap.From:HH:mm:ss}..{to:HH:mm:ss} marked ({gap.Reason})"));
        }

        var parts = settings.Channels.Count;
        var thermometer = settings.Pt100Channel is not null;
        (Reading Reading, double? Celsius)? before = thermometer ? (readings[0], ScanTemperature.Celsius(readings[0])) : null;
        (Reading Reading, double? Celsius)? after = thermometer ? (readings[^1], ScanTemperature.Celsius(readings[^1])) : null;
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
            var celsius = isPt100 ? ScanTemperature.Celsius(reading) : ScanTemperature.Interpolate(before, after, reading.Time);
            await writer.WriteAsync(new DriftWrite(new StoredDriftSample(_runId, channel, reading.Time, reading.Value, celsius), null), ct).ConfigureAwait(false);
            if (!isPt100)
            {
                Publish(channel, reading, celsius);
            }
        }

        _lastGood = finite.Count > 0 ? finite.Max() : _lastGood;
        _scans++;
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
        hub.Publish(new BenchEvent(0, BenchEventKind.Drift, default, Value: reading.Value, DeviationPpm: ppm, State: label,
            Text: string.Create(CultureInfo.InvariantCulture, $"{label} {reading.Value:F4} Ω {ppm:+0.00;-0.00} ppm{temperature}")));
    }
}
