using System.Reflection;
using Xunit.Sdk;

namespace SortRig.Host.Tests.Library;

/// <summary>
/// Theory data row for the PostgreSQL engine. Skipped with a message when SORTRIG_TEST_PG is unset, except on CI
/// (CI=true), where the row runs and fails for want of a server.
/// </summary>
[AttributeUsage(AttributeTargets.Method)]
public sealed class PostgresDataAttribute : DataAttribute
{
    public PostgresDataAttribute()
    {
        if (
            string.IsNullOrWhiteSpace(Environment.GetEnvironmentVariable(TestStore.PgVariable))
            && Environment.GetEnvironmentVariable("CI") != "true"
        )
        {
            Skip =
                $"PostgreSQL row skipped: set {TestStore.PgVariable} (export "
                + $"{TestStore.PgVariable}=\"$(scripts/pg-test-server start)\").";
        }
    }

    public override IEnumerable<object[]> GetData(MethodInfo testMethod) =>
        [
            [StoreEngine.Postgres],
        ];
}
