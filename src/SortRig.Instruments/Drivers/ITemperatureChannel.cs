using SortRig.Measurement.Readings;

namespace SortRig.Instruments.Drivers;

/// <summary>A meter that can read a temperature channel (profile template temperature_channel).</summary>
public interface ITemperatureChannel
{
    /// <summary>True when the profile has a temperature_channel template.</summary>
    bool HasTemperatureChannel { get; }

    /// <summary>Reads the temperature channel, in degrees Celsius as the meter reports it.</summary>
    /// <exception cref="NotSupportedException">The profile has no temperature_channel template.</exception>
    Task<Reading> ReadTemperatureAsync(int channel, CancellationToken ct);
}
