using SortRig.Host.LibraryVerb;
using SortRig.Storage.Contracts;

namespace SortRig.Host.VerbSupport;

/// <summary>Says why the library refused ids: unknown, not live, or in the wrong status for the change.</summary>
internal static class Refusals
{
    /// <summary>"7 (unknown id)", "9 (Taken by mira)": one line per id, in order.</summary>
    public static async Task<IReadOnlyList<string>> DescribeAsync(
        IPrecisionLog log,
        IReadOnlyList<long> ids,
        CancellationToken cancellationToken
    ) => await DescribeAsync(log, ids, [], cancellationToken).ConfigureAwait(false);

    /// <summary>As above, preferring what the refusal itself saw (<see cref="LibraryResult.Holders"/>): after a lost
    /// race it names the bench that won even if it has released the part since.</summary>
    public static async Task<IReadOnlyList<string>> DescribeAsync(
        IPrecisionLog log,
        IReadOnlyList<long> ids,
        IReadOnlyList<LibraryHolder> holders,
        CancellationToken cancellationToken
    )
    {
        var parts = new List<string>();
        foreach (var id in ids)
        {
            if (holders.FirstOrDefault(h => h.PartId == id) is { } seen)
            {
                parts.Add($"{id} ({Why(seen.State, seen.Status, seen.TakenBy)})");
                continue;
            }

            var part = await log.GetPartAsync(id, cancellationToken).ConfigureAwait(false);
            parts.Add($"{id} ({Why(part)})");
        }

        return parts;
    }

    /// <summary>Ids that name no part, in order.</summary>
    public static async Task<IReadOnlyList<long>> UnknownAsync(
        IPrecisionLog log,
        IReadOnlyList<long> ids,
        CancellationToken cancellationToken
    )
    {
        var unknown = new List<long>();
        foreach (var id in ids)
        {
            if (await log.GetPartAsync(id, cancellationToken).ConfigureAwait(false) is null)
            {
                unknown.Add(id);
            }
        }

        return unknown;
    }

    private static string Why(PartState state, LibraryStatus status, string? takenBy) =>
        state is PartState.Accepted or PartState.Announced
            ? status switch
            {
                LibraryStatus.Taken => $"Taken by {takenBy ?? "someone"}",
                LibraryStatus.Used => $"Used{(takenBy is { } by ? " (taken by " + by + ")" : "")}",
                _ => status.ToString(),
            }
            : $"not in the library: {state}";

    private static string Why(PartRecord? part) =>
        part switch
        {
            null => "unknown id",
            { IsLive: false } => $"not in the library: {part.State}",
            { LibraryStatus: LibraryStatus.Taken } => $"Taken by {part.TakenBy ?? "someone"}",
            { LibraryStatus: LibraryStatus.Used } => $"Used{(part.TakenBy is { } by ? " (taken by " + by + ")" : "")}",
            _ => part.LibraryStatus.ToString(),
        };
}
