namespace SortRig.Storage.Contracts;

/// <summary>
/// A library search. Only live parts (Accepted/Announced) are found. Every filter is optional; results are
/// ordered by deviation, then id.
/// </summary>
/// <param name="Nominal">Nominal value, ohms; matches parts whose nominal is within 1e-9 relative; null for
/// any.</param>
/// <param name="MinDeviationPpm">Lowest deviation from nominal, ppm (inclusive); null for no bound.</param>
/// <param name="MaxDeviationPpm">Highest deviation from nominal, ppm (inclusive); null for no bound.</param>
/// <param name="Status">Library status; default Available; null for any.</param>
/// <param name="Location">Exact storage location; null for any.</param>
/// <param name="Limit">At most this many parts, 1..100 000, default 1 000.</param>
public sealed record LibraryQuery(
    double? Nominal = null,
    double? MinDeviationPpm = null,
    double? MaxDeviationPpm = null,
    LibraryStatus? Status = LibraryStatus.Available,
    string? Location = null,
    int Limit = 1000
);

/// <summary>
/// Verdict of an all-or-none library change (take, release, use, retire).
/// </summary>
/// <param name="Changed">Parts as stored after the change, by id; empty when refused.</param>
/// <param name="Refused">Requested ids that were not in a state allowing the change (or do not exist); when non-empty
/// nothing was changed.</param>
public sealed record LibraryResult(IReadOnlyList<PartRecord> Changed, IReadOnlyList<long> Refused)
{
    /// <summary>True when every requested part was changed.</summary>
    public bool Succeeded => Refused.Count == 0;

    /// <summary>
    /// For each refused id that exists: its state, status and taker as they were when the change was refused (read in
    /// the same transaction, under the row lock), in id order. Empty when the change succeeded.
    /// </summary>
    public IReadOnlyList<LibraryHolder> Holders { get; init; } = [];
}
