using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>The build target of a session (schema version 4).</summary>
internal abstract partial class AdoPrecisionLog
{
    public Task SetBuildTargetAsync(long sessionId, BuildTargetRecord target, CancellationToken cancellationToken)
    {
        Guard.Id(sessionId, nameof(sessionId));
        ArgumentNullException.ThrowIfNull(target);
        Guard.Text(target.RecipeName, nameof(target.RecipeName));
        Guard.Text(target.RecipePath, nameof(target.RecipePath));
        Guard.Text(target.RecipeYaml, nameof(target.RecipeYaml));
        Guard.TextOrNull(target.CsvPath, nameof(target.CsvPath));
        if (target.Sets is < 1 or > 64)
        {
            throw new ArgumentOutOfRangeException(nameof(target), target.Sets, "Sets must be 1 to 64");
        }

        const string operation = "record build target";
        return WriteAsync(
            operation,
            async (s, ct) =>
            {
                _ = await GetSessionCoreAsync(s, sessionId, ct).ConfigureAwait(false)
                    ?? throw NotFound(operation, $"Session {sessionId}");
                return await s.Sql(
                        "INSERT INTO build_targets (session_id, recipe_name, recipe_path, recipe_yaml, sets, "
                            + "csv_path, set_at) "
                            + "VALUES (@session, @name, @path, @yaml, @sets, @csv, @at) ON CONFLICT (session_id) DO "
                            + "UPDATE SET "
                            + "recipe_name = excluded.recipe_name, recipe_path = excluded.recipe_path, recipe_yaml = "
                            + "excluded.recipe_yaml, "
                            + "sets = excluded.sets, csv_path = excluded.csv_path, set_at = excluded.set_at"
                    )
                    .With("session", sessionId)
                    .With("name", target.RecipeName)
                    .With("path", target.RecipePath)
                    .With("yaml", target.RecipeYaml)
                    .With("sets", target.Sets)
                    .With("csv", target.CsvPath)
                    .With("at", TimeValue(Time.GetUtcNow()))
                    .ExecuteAsync(ct)
                    .ConfigureAwait(false);
            },
            cancellationToken
        );
    }

    public Task<BuildTargetRecord?> GetBuildTargetAsync(long sessionId, CancellationToken cancellationToken)
    {
        Guard.Id(sessionId, nameof(sessionId));
        return ReadAsync(
            "read build target",
            (s, ct) =>
                s.Sql(
                        "SELECT recipe_name, recipe_path, recipe_yaml, sets, csv_path FROM build_targets WHERE "
                            + "session_id = @session"
                    )
                    .With("session", sessionId)
                    .FirstOrDefaultAsync(
                        r => new BuildTargetRecord(
                            r.GetString(0),
                            r.GetString(1),
                            r.GetString(2),
                            r.GetInt32(3),
                            ReadText(r, 4)
                        ),
                        ct
                    ),
            cancellationToken
        );
    }
}
