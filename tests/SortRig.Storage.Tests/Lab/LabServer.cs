using Npgsql;

namespace SortRig.Storage.Tests.Lab;

/// <summary>
/// The test server from SORTRIG_TEST_PG (scripts/pg-test-server), connected as its superuser. Unset: the test is
/// skipped with a message, except on CI (CI=true), where it fails. Names made here come from GUIDs, never input.
/// </summary>
internal static class LabServer
{
    public static string ConnectionString()
    {
        var value = Environment.GetEnvironmentVariable("SORTRIG_TEST_PG");
        if (string.IsNullOrWhiteSpace(value))
        {
            if (Environment.GetEnvironmentVariable("CI") == "true")
            {
                throw new InvalidOperationException(
                    "SORTRIG_TEST_PG is not set on CI: start a server with scripts/pg-test-server start and export "
                        + "its output."
                );
            }

            Skip.If(
                true,
                "PostgreSQL lab tests skipped: set SORTRIG_TEST_PG (export "
                    + "SORTRIG_TEST_PG=\"$(scripts/pg-test-server start)\")."
            );
        }

        return value!;
    }

    /// <summary>A fresh lower-case name with a prefix, e.g. lw_3f2a9c1d.</summary>
    public static string Name(string prefix) => $"{prefix}_{Guid.NewGuid():N}"[..(prefix.Length + 9)];

    /// <summary>The server's connection string logged in as another role (no password; add one with extra).</summary>
    public static string As(string role, string extra = "")
    {
        var builder = new NpgsqlConnectionStringBuilder(ConnectionString()) { Username = role };
        return builder.ConnectionString + extra;
    }

    public static async Task ExecuteAsync(string connectionString, string sql)
    {
        await using var connection = new NpgsqlConnection(connectionString);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand(sql, connection);
        await command.ExecuteNonQueryAsync();
    }

    public static async Task<object?> ScalarAsync(string connectionString, string sql)
    {
        await using var connection = new NpgsqlConnection(connectionString);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand(sql, connection);
        return await command.ExecuteScalarAsync();
    }

    /// <summary>Drops a lab made by a test: its schema, then what the roles own and the roles.</summary>
    public static async Task DropLabAsync(string schema, params string[] roles)
    {
        var admin = ConnectionString();
        await ExecuteAsync(admin, $"DROP SCHEMA IF EXISTS {schema} CASCADE");
        foreach (var role in roles)
        {
            await ExecuteAsync(
                admin,
                $"DO $$ BEGIN IF EXISTS (SELECT 1 FROM pg_roles WHERE rolname = '{role}') THEN EXECUTE 'DROP OWNED "
                    + $"BY {role} CASCADE'; EXECUTE 'DROP ROLE {role}'; END IF; END $$"
            );
        }
    }
}
