using SortRig.Engine.Events;

namespace SortRig.Host.Live;

/// <summary>
/// Decides when the live view redraws: every event that changes what the operator must act on
/// (announcement, counts, notice, end) at once, live readings at most once per <see cref="Interval"/>.
/// Readings arrive tens of times a second; redrawing for each floods a slow terminal and makes the view
/// fall behind the bench.
/// </summary>
/// <param name="time">Clock of the frames (the system clock in the program, a fake one in tests).</param>
/// <param name="interval">Shortest time between two frames drawn for readings. Default 250 ms (4 frames a
/// second).</param>
internal sealed class FramePacer(TimeProvider time, TimeSpan? interval = null)
{
    private long? _lastFrame;

    /// <summary>Shortest time between two reading frames.</summary>
    public TimeSpan Interval { get; } = interval ?? TimeSpan.FromMilliseconds(250);

    /// <summary>True when an event of this kind should be drawn now; counts the frame when it is.</summary>
    public bool Due(BenchEventKind kind)
    {
        var now = time.GetTimestamp();
        var reading = kind is BenchEventKind.Reading or BenchEventKind.Drift;
        if (reading && _lastFrame is { } last && time.GetElapsedTime(last, now) < Interval)
        {
            return false;
        }

        _lastFrame = now;
        return true;
    }
}
