using System.Globalization;
using SortRig.Host.LibraryVerb;
using SortRig.Host.VerbSupport;
using SortRig.Storage.Contracts;

namespace SortRig.Host.PlanVerb;

/// <summary>Finds a session by name (the newest with that name) or by id.</summary>
internal static class SessionLookup
{
    /// <exception cref="VerbException">No session has that name or id; the message lists the newest sessions.</exception>
    public static async Task<SessionInfo> FindAsync(ISessionReader log, string nameOrId, CancellationToken cancellationToken)
    {
        var sessions = await log.ListSessionsAsync(cancellationToken).ConfigureAwait(false);
        var byName = sessions.FirstOrDefault(s => s.Name == nameOrId);
        if (byName is not null)
        {
            return byName;
        }

        if (long.TryParse(nameOrId, NumberStyles.None, CultureInfo.InvariantCulture, out var id) && sessions.FirstOrDefault(s => s.Id == id) is { } byId)
        {
            return byId;
        }

        var known = sessions.Count == 0
            ? "the log has no sessions"
            : "newest sessions: " + string.Join(", ", sessions.Take(8).Select(s => $"'{s.Name}' (id {s.Id})"));
        throw new VerbException($"--session: no session named or numbered '{nameOrId}'; {known}");
    }
}
