namespace SortRig.Engine.Announcing;

/// <summary>Tells the operator something: on the console, by voice, on the web page.</summary>
public interface IAnnouncer
{
    /// <summary>Announces; must not throw for presentation failures (log them instead).</summary>
    ValueTask AnnounceAsync(Announcement announcement, CancellationToken cancellationToken);
}
