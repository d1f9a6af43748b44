namespace SortRig.Host.ReportVerb;

/// <summary>What the report verb is asked for. At least one of <see cref="Session"/> and <see
/// cref="DriftRunId"/>.</summary>
/// <param name="Database">Storage connection string (SQLite path or PostgreSQL).</param>
/// <param name="Output">Report folder: new or empty (created), or with <paramref name="Force"/> an earlier report's
/// folder.</param>
/// <param name="Session">Session name (the newest with that name) or id, or null.</param>
/// <param name="DriftRunId">Drift run id, or null.</param>
/// <param name="Cups">Cups of the sort, to draw band edges; null infers it from the parts' recorded cups.</param>
/// <param name="Force">Replace the files of a report already in <paramref name="Output"/> (never through a symbolic
/// link).</param>
internal sealed record ReportRequest(
    string Database,
    string Output,
    string? Session,
    long? DriftRunId,
    int? Cups = null,
    bool Force = false
)
{
    /// <summary>Throws <see cref="ArgumentException"/> naming the bad flag.</summary>
    public ReportRequest Validate()
    {
        if (string.IsNullOrWhiteSpace(Database))
        {
            throw new ArgumentException(
                "--db must name a SQLite file or a PostgreSQL connection string.",
                nameof(Database)
            );
        }

        if (string.IsNullOrWhiteSpace(Output))
        {
            throw new ArgumentException("--out must name the report folder.", nameof(Output));
        }

        if (string.IsNullOrWhiteSpace(Session) && DriftRunId is null)
        {
            throw new ArgumentException("give --session NAME|ID, --drift-run ID or both.", nameof(Session));
        }

        if (DriftRunId is <= 0)
        {
            throw new ArgumentException($"--drift-run must be a run id >= 1; was {DriftRunId}.", nameof(DriftRunId));
        }

        if (Cups is < 1 or > global::SortRig.Planning.Cups.CupLabels.MaxCups)
        {
            throw new ArgumentException(
                $"--cups must be 1..{(global::SortRig.Planning.Cups.CupLabels.MaxCups)}; was {Cups}.",
                nameof(Cups)
            );
        }

        return this;
    }
}
