namespace SortRig.Simulator.Meter;

/// <summary>
/// How long one reading takes: NPLC / f_line for the signal, the same again for the autozero
/// reference when autozero is on, plus a fixed overhead.
/// </summary>
internal static class IntegrationTiming
{
    public static readonly TimeSpan Overhead = TimeSpan.FromMilliseconds(1);

    /// <summary>Relay settle time before the first reading on a scanner channel.</summary>
    public static readonly TimeSpan ChannelSwitch = TimeSpan.FromMilliseconds(5);

    public static TimeSpan Reading(double nplc, bool autoZero, double lineHz)
    {
        var seconds = nplc / lineHz * (autoZero ? 2 : 1);
        return TimeSpan.FromTicks((long)Math.Round(seconds * TimeSpan.TicksPerSecond)) + Overhead;
    }
}
