namespace SortRig.Bench.Settling;

/// <summary>
/// The benchmark's virtual clock: time stands still until the harness moves it. The simulator reads it for the
/// bench epoch and the instant of each insertion; readings are sampled at explicit instants after that, so no
/// timer ever has to fire and nothing depends on the wall clock.
/// </summary>
internal sealed class VirtualClock(DateTimeOffset start) : TimeProvider
{
    private DateTimeOffset _now = start;

    public override DateTimeOffset GetUtcNow() => _now;

    public void MoveTo(DateTimeOffset instant) =>
        _now = instant >= _now ? instant : throw new ArgumentOutOfRangeException(nameof(instant), instant, "The virtual clock never runs backwards.");
}
