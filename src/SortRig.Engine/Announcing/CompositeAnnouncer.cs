namespace SortRig.Engine.Announcing;

/// <summary>Announces through several announcers in order.</summary>
public sealed class CompositeAnnouncer(IEnumerable<IAnnouncer> announcers) : IAnnouncer
{
    private readonly IAnnouncer[] _announcers = [.. announcers];

    /// <inheritdoc />
    public async ValueTask AnnounceAsync(Announcement announcement, CancellationToken cancellationToken)
    {
        foreach (var announcer in _announcers)
        {
            await announcer.AnnounceAsync(announcement, cancellationToken).ConfigureAwait(false);
        }
    }
}
