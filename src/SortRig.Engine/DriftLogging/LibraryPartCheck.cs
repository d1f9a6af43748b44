using System.Globalization;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.DriftLogging;

/// <summary>
/// Checks, before a drift run is started, that every part put on a channel is in the library: a known id, a live
/// part (accepted or announced, not undone or remeasured) and not retired. Taken and used parts may be logged.
/// </summary>
internal static class LibraryPartCheck
{
    /// <exception cref="ArgumentException">Names <see cref="LibraryPartMap.Option"/>, the channel=part item and why it
    /// is refused.</exception>
    public static async Task CheckAsync(
        IPrecisionLog log,
        IReadOnlyDictionary<int, long> parts,
        CancellationToken cancellationToken
    )
    {
        foreach (var (channel, id) in parts.OrderBy(p => p.Key))
        {
            var part = await log.GetPartAsync(id, cancellationToken).ConfigureAwait(false);
            var why = part switch
            {
                null => "no part has this id",
                { IsLive: false } => $"the part is not in the library (its session state is {part.State})",
                { LibraryStatus: LibraryStatus.Retired } => "the part is retired",
                _ => null,
            };
            if (why is not null)
            {
                throw LibraryPartMap.Bad(
                    string.Create(CultureInfo.InvariantCulture, $"{channel}={id}"),
                    why + "; nothing was logged"
                );
            }
        }
    }
}
