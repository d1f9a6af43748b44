using System.Globalization;
using SortRig.Host.LibraryVerb;
using SortRig.Host.VerbSupport;
using SortRig.Storage.Contracts;

namespace SortRig.Host.PlanVerb;

/// <summary>Finds a session by name (the newest with that name) or by id.</summary>
internal static class SessionLookup
{
    /// <param name="log">The log to look in.</param>
    /// <param name="nameOrId">A session name or id, as typed.</param>
    /// <param name="tell">Told which session was taken when several have that name (never silently the newest).</param>
    /// <param name="cancellationToken">Stops the lookup.</param>
    /// <exception cref="VerbException">No session has that name or id; the message lists the newest
    /// sessions.</exception>
    public static async Task<SessionInfo> FindAsync(
        ISessionReader log,
        string nameOrId,
        CancellationToken cancellationToken,
        Action<string>? tell = null
    )
    {
        var sessions = await log.ListSessionsAsync(cancellationToken).ConfigureAwait(false);
        var named = sessions.Where(s => s.Name == nameOrId).ToList();
        if (named.Count > 0)
        {
            if (named.Count > 1)
            {
                tell?.Invoke(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"{named.Count} sessions are named '{nameOrId}': taking the newest (id {named[0].Id}, "
                            + $"started {named[0].StartedAt:yyyy-MM-dd HH:mm}); the others have ids "
                            + $"{string.Join(", ", named.Skip(1).Select(s => s.Id))}, give --session an id to take "
                            + $"one of them"
                    )
                );
            }

            return named[0];
        }

        if (
            long.TryParse(nameOrId, NumberStyles.None, CultureInfo.InvariantCulture, out var id)
            && sessions.FirstOrDefault(s => s.Id == id) is { } byId
        )
        {
            return byId;
        }

        var known =
            sessions.Count == 0
                ? "the log has no sessions"
                : "newest sessions: " + string.Join(", ", sessions.Take(8).Select(s => $"'{s.Name}' (id {s.Id})"));
        throw new VerbException($"--session: no session named or numbered '{nameOrId}'; {known}");
    }
}
