namespace SortRig.Storage.Contracts;

/// <summary>
/// Where a refused part stands, read under the same row lock as the refusal: so a bench that lost a race for a part is
/// told which part it was and who has it now.
/// </summary>
/// <param name="PartId">The refused part.</param>
/// <param name="State">Its record state (a part no longer live cannot be moved).</param>
/// <param name="Status">Its library status at the refusal.</param>
/// <param name="TakenBy">Who took it (Taken or Used), or null.</param>
public sealed record LibraryHolder(long PartId, PartState State, LibraryStatus Status, string? TakenBy);
