using System.Globalization;
using SortRig.Measurement.Ranging;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Specs;

namespace SortRig.Engine.Sorting;

/// <summary>The batch cannot be measured as asked; <see cref="Remedies"/> says what would work.</summary>
public sealed class SortPlanException(string message, IReadOnlyList<string> remedies)
    : Exception(remedies.Count == 0 ? message : message + " Remedies: " + string.Join("; ", remedies) + ".")
{
    /// <summary>Concrete changes that would make the batch measurable.</summary>
    public IReadOnlyList<string> Remedies { get; } = remedies;
}
