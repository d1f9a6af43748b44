using SortRig.Instruments.Scpi;
using SortRig.Measurement.Readings;

namespace SortRig.Instruments.Drivers;

/// <summary>Scanner channels (drift logging).</summary>
internal sealed partial class ScpiResistanceMeter : IResistanceMeter, ITemperatureChannel
{
    public async Task<IReadOnlyList<Reading>> ReadChannelsAsync(IReadOnlyList<int> channels, CancellationToken ct)
    {
        var applied = _applied
            ?? throw new InvalidOperationException("ConfigureAsync must succeed before ReadChannelsAsync");
        ArgumentOutOfRangeException.ThrowIfZero(channels.Count, nameof(channels));
        foreach (var bad in channels.Where(c => c is < 1 or > 9999))
        {
            throw new ArgumentOutOfRangeException(nameof(channels), bad, "channel numbers must be 1 to 9999");
        }

        if (Commands.ScannerClose is { } close)
        {
            var readings = new List<Reading>(channels.Count);
            foreach (var channel in channels)
            {
                var values = applied.With("channels", channel);
                await _session.WriteAsync(close.Render(values), ct).ConfigureAwait(false);
                await _session.CheckErrorsAsync(ct).ConfigureAwait(false);
                readings.Add(await ReadAsync(ct).ConfigureAwait(false));
                if (Commands.ScannerOpen is { } open)
                {
                    await _session.WriteAsync(open.Render(values), ct).ConfigureAwait(false);
                }
            }

            return readings;
        }

        var scan = Commands.ScannerScan
            ?? throw new NotSupportedException(
                $"profile '{Profile.Family}' has no scanner_close or scanner_scan template"
            );
        await _session
            .WriteAsync(scan.Render(applied.With("channels", string.Join(',', channels))), ct)
            .ConfigureAwait(false);
        await _session.CheckErrorsAsync(ct).ConfigureAwait(false);
        var command = Commands.Read.Render(applied.Values);
        var numbers = await _session
            .QueryNumbersAsync(command, ReadTimeout(applied, channels.Count), ct)
            .ConfigureAwait(false);
        return numbers.Count == channels.Count
            ?
            [
                .. numbers.Select(n =>
                    ToReading(n, applied.Range.FullScale, command, string.Join(',', numbers.Select(n => Ohms(n.Value))))
                ),
            ]
            : throw new ScpiResponseException(
                command,
                string.Join(',', numbers.Select(n => Ohms(n.Value))),
                $"{channels.Count} readings, one per channel"
            );
    }
}
