namespace SortRig.Engine.Sorting;

/// <summary>
/// The hands at the fixture. A person needs no call (they hear the announcement); the embedded
/// simulator's virtual operator is told here when to take the part out and fetch the next.
/// </summary>
public interface IFixtureHands
{
    /// <summary>The part in the fixture has been announced (cup, reject or unstable).</summary>
    void PartAnnounced();

    /// <summary>A session resumes with this many parts already recorded: carry on from the next one.</summary>
    void ResumeAt(int partsRecorded);

    /// <summary>The loop is connected, has set the meter up and reads the fixture: the first part may go in.</summary>
    void Ready();

    /// <summary>
    /// The operator was asked to put one part of <paramref name="nominal"/> ohms in the fixture as a bridging part
    /// (range transfer): from the earlier batch, or from this one when it is on the lower range. Returns once it is
    /// handed in (at once for a person).
    /// </summary>
    Task PlaceBridgingPartAsync(double nominal, CancellationToken ct);

    /// <summary>The operator was asked to take the bridging part out (also the check part or a part measured
    /// again).</summary>
    void RemoveBridgingPart();

    /// <summary>
    /// The operator was asked to put the check standard of <paramref name="nominal"/> ohms in the fixture; feeding
    /// reel parts stops until <see cref="ResumeAt"/>. Returns once it is handed in (at once for a person).
    /// </summary>
    Task PlaceCheckPartAsync(double nominal, CancellationToken ct);

    /// <summary>
    /// The operator was asked to put an already sorted part back in the fixture to be measured again: the
    /// <paramref name="reelPosition"/>-th part fed in this session (0-based). Returns once it is handed in.
    /// </summary>
    Task PlacePartAgainAsync(int reelPosition, CancellationToken ct);
}
