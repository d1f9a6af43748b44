namespace SortRig.Storage.Contracts;

/// <summary>The calibrated part library: find, take, release, mark used, retire and locate parts. One role of <see
/// cref="IPrecisionLog"/>; the same transaction, fault and argument rules.</summary>
public interface IPartLibrary
{
    /// <summary>Searches the library.</summary>
    Task<IReadOnlyList<PartRecord>> FindPartsAsync(LibraryQuery query, CancellationToken cancellationToken);

    /// <summary>Takes parts from the library: all of them (Available and live) or none. A part is never taken twice,
    /// even by two benches at once.</summary>
    Task<LibraryResult> TakePartsAsync(
        IReadOnlyList<long> partIds,
        string takenBy,
        CancellationToken cancellationToken
    );

    /// <summary>Gives taken parts back (Taken becomes Available); all or none.</summary>
    Task<LibraryResult> ReleasePartsAsync(IReadOnlyList<long> partIds, CancellationToken cancellationToken);

    /// <summary>Marks taken parts as fitted into a build (Taken becomes Used); all or none.</summary>
    Task<LibraryResult> MarkUsedAsync(IReadOnlyList<long> partIds, string? usedIn, CancellationToken cancellationToken);

    /// <summary>Retires parts (any status but Retired becomes Retired); all or none.</summary>
    Task<LibraryResult> RetireAsync(IReadOnlyList<long> partIds, string reason, CancellationToken cancellationToken);

    /// <summary>Sets (or clears with null) the storage location of a part.</summary>
    Task<PartRecord> SetLocationAsync(long partId, string? location, CancellationToken cancellationToken);
}
