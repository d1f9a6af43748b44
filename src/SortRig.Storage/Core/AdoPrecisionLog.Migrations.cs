using SortRig.Storage.Contracts;
using SortRig.Storage.Migrations;

namespace SortRig.Storage.Core;

/// <summary>
/// Schema migrations. Each pending script runs in its own write transaction together with the row that records its
/// version, so a migration interrupted by a crash or an error leaves the store at the previous version.
/// </summary>
internal abstract partial class AdoPrecisionLog
{
    /// <summary>CREATE TABLE IF NOT EXISTS schema_version in the engine's dialect.</summary>
    private protected abstract string SchemaVersionDdl { get; }

    private protected abstract Task<bool> SchemaVersionExistsAsync(DbScope scope, CancellationToken cancellationToken);

    /// <summary>Serialises concurrent migrators (PostgreSQL advisory lock; SQLite's write lock already does).</summary>
    private protected virtual Task LockForMigrationAsync(DbScope scope, CancellationToken cancellationToken) =>
        Task.CompletedTask;

    private protected async Task<int> ReadSchemaVersionAsync(DbScope s, CancellationToken ct) =>
        await SchemaVersionExistsAsync(s, ct).ConfigureAwait(false)
            ? (int)(
                await s.Sql("SELECT COALESCE(MAX(version), 0) FROM schema_version")
                    .ScalarLongAsync(ct)
                    .ConfigureAwait(false)
                ?? 0
            )
            : 0;

    /// <summary>Brings the schema to the last of <paramref name="migrations"/>; returns the version reached.</summary>
    private protected async Task<int> MigrateAsync(
        IReadOnlyList<Migration> migrations,
        CancellationToken cancellationToken
    )
    {
        int latest = migrations.Count == 0 ? 0 : migrations[^1].Version;
        int current = await ReadAsync("read schema version", ReadSchemaVersionAsync, cancellationToken)
            .ConfigureAwait(false);
        if (current > latest)
        {
            throw new StorageException(
                "open",
                StorageFault.Schema,
                Target,
                $"the schema is at version {current}, newer than this build knows ({latest}); use a newer SortRig."
            );
        }

        foreach (var migration in migrations.Where(m => m.Version > current))
        {
            string operation = $"apply schema migration {migration.Version} ({migration.Name})";
            try
            {
                bool applied = await WriteAsync(
                        operation,
                        async (s, ct) =>
                        {
                            await LockForMigrationAsync(s, ct).ConfigureAwait(false);
                            await s.Sql(SchemaVersionDdl).ExecuteAsync(ct).ConfigureAwait(false);
                            if (await ReadSchemaVersionAsync(s, ct).ConfigureAwait(false) >= migration.Version)
                            {
                                return false; // another process got there first
                            }

                            await s.Sql(migration.Sql).ExecuteAsync(ct).ConfigureAwait(false);
                            await s.Sql(
                                    "INSERT INTO schema_version (version, name, applied_at) VALUES (@v, @name, @at)"
                                )
                                .With("v", migration.Version)
                                .With("name", migration.Name)
                                .With("at", TimeValue(Time.GetUtcNow()))
                                .ExecuteAsync(ct)
                                .ConfigureAwait(false);
                            return true;
                        },
                        cancellationToken
                    )
                    .ConfigureAwait(false);
                if (applied)
                {
                    Log.MigrationApplied(Logger, migration.Version, migration.Name, Target);
                }
            }
            catch (StorageException e) when (e.Fault is StorageFault.ReadOnly && Engine == StorageEngine.Postgres)
            {
                // A bench logged in as the lab's writer role may not change the schema: the keeper runs it as the
                // owner.
                throw new StorageException(
                    operation,
                    StorageFault.Schema,
                    Target,
                    $"the schema is at version {current} and this build needs {latest}, but this role may not change "
                        + $"the schema; "
                        + $"open the log once as the lab's owner role to migrate it (docs/lab.md) ("
                        + $"{e.InnerException?.Message})",
                    e
                );
            }
            catch (StorageException e) when (e.Fault is StorageFault.Other or StorageFault.Constraint)
            {
                throw new StorageException(
                    operation,
                    StorageFault.Schema,
                    Target,
                    $"the script failed and was rolled back; the schema stays at version {migration.Version - 1} ("
                        + $"{e.InnerException?.Message})",
                    e
                );
            }
        }

        return latest;
    }
}
