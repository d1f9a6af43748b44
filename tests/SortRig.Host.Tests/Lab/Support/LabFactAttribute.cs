namespace SortRig.Host.Tests.Lab.Support;

/// <summary>
/// A lab test: needs the PostgreSQL server of SORTRIG_TEST_PG. Skipped with a message when it is unset, except on
/// CI (CI=true), where the test runs and fails for want of a server.
/// </summary>
[AttributeUsage(AttributeTargets.Method)]
public sealed class LabFactAttribute : FactAttribute
{
    public LabFactAttribute()
    {
        if (
            string.IsNullOrWhiteSpace(Environment.GetEnvironmentVariable(LabStore.PgVariable))
            && Environment.GetEnvironmentVariable("CI") != "true"
        )
        {
            Skip =
                $"lab test skipped: set {LabStore.PgVariable} (export "
                + $"{LabStore.PgVariable}=\"$(scripts/pg-test-server start)\").";
        }
    }
}
