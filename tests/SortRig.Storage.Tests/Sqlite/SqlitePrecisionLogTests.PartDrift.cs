using Microsoft.Data.Sqlite;
using SortRig.Storage.Core;

namespace SortRig.Storage.Tests.Sqlite;

public sealed partial class SqlitePrecisionLogTests
{
    [Fact]
    public async Task PartDriftRuns_QueryPlan_FindsChannelsByPartAndSamplesByChannelIndex()
    {
        await CreateLogAsync();
        var filtered = AdoPrecisionLog.PartDriftSql(" AND c.part_id IN (@i0, @i1)");

        // SQLite's own planner on a separate connection (https://sqlite.org/eqp.html).
        var plan = await QueryPlanAsync(filtered);

        Assert.Contains(plan, step => step.Contains("ix_drift_channels_part", StringComparison.Ordinal));
        Assert.Contains(plan, step =>
            step.Contains("ix_drift_samples_channel (run_id=? AND channel=?)", StringComparison.Ordinal)
        );
        Assert.DoesNotContain(plan, step => step.StartsWith("SCAN d", StringComparison.Ordinal));
    }

    private async Task<List<string>> QueryPlanAsync(string sql)
    {
        await using var connection = new SqliteConnection($"Data Source={FilePath};Pooling=False");
        await connection.OpenAsync();
        await using var command = connection.CreateCommand();
        command.CommandText = "EXPLAIN QUERY PLAN " + sql;
        command.Parameters.AddWithValue("@i0", 1L);
        command.Parameters.AddWithValue("@i1", 2L);
        var steps = new List<string>();
        await using var reader = await command.ExecuteReaderAsync();
        while (await reader.ReadAsync())
        {
            steps.Add(reader.GetString(3));
        }

        return steps;
    }
}
