using System.Data.Common;
using System.Globalization;

namespace SortRig.Storage.Core;

/// <summary>A connection and, for writes, its transaction; hands out parameterised queries bound to both.</summary>
internal sealed class DbScope(DbConnection connection, DbTransaction? transaction)
{
    public DbConnection Connection { get; } = connection;

    public DbTransaction? Transaction { get; } = transaction;

    /// <summary>Set by a write that decided to change nothing (e.g. a duplicate commit); the transaction is rolled
    /// back.</summary>
    public bool RollbackOnly { get; set; }

    public Query Sql(string sql)
    {
        var command = Connection.CreateCommand();
        command.CommandText = sql;
        command.Transaction = Transaction;
        return new Query(command);
    }

    /// <summary>Placeholders "@p0, @p1, ..." for an IN list; the values are bound with <see
    /// cref="Query.WithList"/>.</summary>
    public static string Placeholders(string prefix, int count) =>
        string.Join(
            ", ",
            Enumerable.Range(0, count).Select(i => "@" + prefix + i.ToString(CultureInfo.InvariantCulture))
        );
}

/// <summary>One command with bound parameters; each Execute method runs it once and disposes it.</summary>
internal sealed class Query(DbCommand command)
{
    public DbCommand Command { get; } = command;

    public Query With(string name, object? value)
    {
        var p = Command.CreateParameter();
        p.ParameterName = name;
        p.Value = value ?? DBNull.Value;
        Command.Parameters.Add(p);
        return this;
    }

    public Query WithList<T>(string prefix, IReadOnlyList<T> values)
    {
        for (int i = 0; i < values.Count; i++)
        {
            With(prefix + i.ToString(CultureInfo.InvariantCulture), values[i]);
        }

        return this;
    }

    public async Task<int> ExecuteAsync(CancellationToken cancellationToken)
    {
        await using (Command.ConfigureAwait(false))
        {
            return await Command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
        }
    }

    /// <summary>First column of the first row as a long, or null when there is no row or it is NULL.</summary>
    public async Task<long?> ScalarLongAsync(CancellationToken cancellationToken)
    {
        await using (Command.ConfigureAwait(false))
        {
            var value = await Command.ExecuteScalarAsync(cancellationToken).ConfigureAwait(false);
            return value is null or DBNull ? null : Convert.ToInt64(value, CultureInfo.InvariantCulture);
        }
    }

    public async Task<List<T>> ListAsync<T>(Func<DbDataReader, T> map, CancellationToken cancellationToken)
    {
        await using (Command.ConfigureAwait(false))
        {
            var reader = await Command.ExecuteReaderAsync(cancellationToken).ConfigureAwait(false);
            await using (reader.ConfigureAwait(false))
            {
                var list = new List<T>();
                while (await reader.ReadAsync(cancellationToken).ConfigureAwait(false))
                {
                    list.Add(map(reader));
                }

                return list;
            }
        }
    }

    public async Task<T?> FirstOrDefaultAsync<T>(Func<DbDataReader, T> map, CancellationToken cancellationToken)
        where T : class
    {
        var list = await ListAsync(map, cancellationToken).ConfigureAwait(false);
        return list.Count == 0 ? null : list[0];
    }
}
