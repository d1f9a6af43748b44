namespace SortRig.Host.Sorting;

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
}

/// <summary>A person at the bench: nothing to do.</summary>
public sealed class HumanHands : IFixtureHands
{
    /// <inheritdoc />
    public void PartAnnounced()
    {
    }

    /// <inheritdoc />
    public void ResumeAt(int partsRecorded)
    {
    }
}
