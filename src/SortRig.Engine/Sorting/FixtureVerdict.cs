namespace SortRig.Engine.Sorting;

/// <summary>The fixture watch's verdict on one reading.</summary>
/// <param name="Action">What to do.</param>
/// <param name="Excused">Time to excuse (for <see cref="FixtureAction.Excuse"/>).</param>
/// <param name="Message">What to tell the operator (for <see cref="FixtureAction.Remeasure"/> and <see
/// cref="FixtureAction.NewPart"/>).</param>
internal readonly record struct FixtureVerdict(
    FixtureAction Action,
    TimeSpan Excused = default,
    string? Message = null
);
