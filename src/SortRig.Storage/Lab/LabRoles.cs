using Npgsql;

namespace SortRig.Storage.Lab;

/// <summary>
/// Least privilege on a shared lab server: an owner role that owns the schema and runs migrations, and a writer
/// role for the benches that may read and write rows but not create, alter or drop anything (not even temporary
/// tables). Idempotent: run it again after adding a bench or upgrading. No password is set here; the keeper sets
/// them with psql's \password so they never appear in a script, a command line or a server log.
/// </summary>
public static class LabRoles
{
    /// <summary>The SQL that creates the roles (LOGIN, no password), the schema owned by the owner, and the
    /// grants.</summary>
    /// <param name="names">Role and schema names; validated.</param>
    /// <param name="database">The database the lab uses (its CREATE and TEMPORARY rights are taken from PUBLIC); a
    /// plain identifier.</param>
    /// <exception cref="ArgumentException">A name is not a plain identifier.</exception>
    public static string Script(LabRoleNames names, string database)
    {
        ArgumentNullException.ThrowIfNull(names);
        names.Validate();
        LabRoleNames.Check(database, nameof(database)); // the same identifier rule for the database name
        var (owner, writer, schema) = (names.Owner, names.Writer, names.Schema);
        return $"""
            DO $$ BEGIN
              IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '{owner}') THEN CREATE ROLE {owner} LOGIN; END IF;
              IF NOT EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '{writer}') THEN CREATE ROLE {writer} LOGIN; END IF;
            END $$;
            ALTER ROLE {writer} NOSUPERUSER NOCREATEDB NOCREATEROLE;
            REVOKE CREATE, TEMPORARY ON DATABASE {database} FROM PUBLIC;
            GRANT CONNECT ON DATABASE {database} TO {owner}, {writer};
            REVOKE CREATE ON SCHEMA public FROM PUBLIC;
            CREATE SCHEMA IF NOT EXISTS {schema} AUTHORIZATION {owner};
            REVOKE ALL ON SCHEMA {schema} FROM PUBLIC;
            GRANT USAGE ON SCHEMA {schema} TO {writer};
            GRANT SELECT, INSERT, UPDATE ON ALL TABLES IN SCHEMA {schema} TO {writer};
            GRANT USAGE, SELECT ON ALL SEQUENCES IN SCHEMA {schema} TO {writer};
            ALTER DEFAULT PRIVILEGES FOR ROLE {owner} IN SCHEMA {schema}
                GRANT SELECT, INSERT, UPDATE ON TABLES TO {writer};
            ALTER DEFAULT PRIVILEGES FOR ROLE {owner} IN SCHEMA {schema}
                GRANT USAGE, SELECT ON SEQUENCES TO {writer};
            ALTER ROLE {owner} IN DATABASE {database} SET search_path = {schema};
            ALTER ROLE {writer} IN DATABASE {database} SET search_path = {schema};
            """;
    }

    /// <summary>
    /// Runs <see cref="Script"/> on the server, connected as a role allowed to create roles and schemas (the
    /// server's superuser or a keeper with CREATEROLE). The database is the one the connection string names.
    /// </summary>
    /// <param name="adminConnectionString">Npgsql connection string of the administering role; its password, if any,
    /// comes from the environment or a passfile as usual.</param>
    /// <param name="names">Role and schema names.</param>
    /// <param name="cancellationToken">Caller cancellation.</param>
    public static async Task ApplyAsync(
        string adminConnectionString,
        LabRoleNames names,
        CancellationToken cancellationToken
    )
    {
        var builder = new NpgsqlConnectionStringBuilder(adminConnectionString);
        var sql = Script(
            names,
            builder.Database
                ?? throw new ArgumentException(
                    "The connection string names no Database.",
                    nameof(adminConnectionString)
                )
        );
        var connection = new NpgsqlConnection(adminConnectionString);
        await using (connection.ConfigureAwait(false))
        {
            await connection.OpenAsync(cancellationToken).ConfigureAwait(false);
            var command = new NpgsqlCommand(sql, connection);
            await using (command.ConfigureAwait(false))
            {
                await command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
            }
        }
    }
}
