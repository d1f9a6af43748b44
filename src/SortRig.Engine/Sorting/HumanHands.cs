namespace SortRig.Engine.Sorting;

/// <summary>A person at the bench: nothing to do.</summary>
public sealed class HumanHands : IFixtureHands
{
    /// <inheritdoc />
    public void PartAnnounced() { }

    /// <inheritdoc />
    public void ResumeAt(int partsRecorded) { }

    /// <inheritdoc />
    public void Ready() { }

    /// <inheritdoc />
    public Task PlaceBridgingPartAsync(double nominal, CancellationToken ct) => Task.CompletedTask;

    /// <inheritdoc />
    public void RemoveBridgingPart() { }

    /// <inheritdoc />
    public Task PlaceCheckPartAsync(double nominal, CancellationToken ct) => Task.CompletedTask;

    /// <inheritdoc />
    public Task PlacePartAgainAsync(int reelPosition, CancellationToken ct) => Task.CompletedTask;
}
