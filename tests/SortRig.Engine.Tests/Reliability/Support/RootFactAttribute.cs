namespace SortRig.Engine.Tests.Reliability.Support;

/// <summary>
/// A fact that needs root (mount, chattr) and the named programs: skipped with the reason when they
/// are missing, except on CI (CI=true), where it must run and fails instead.
/// </summary>
public sealed class RootFactAttribute : FactAttribute
{
    public RootFactAttribute(params string[] programs)
    {
        if (Environment.GetEnvironmentVariable("CI") == "true")
        {
            return;
        }

        if (Environment.UserName != "root")
        {
            Skip = "needs root (mounts a tmpfs, sets file attributes)";
        }
        else if (
            programs.FirstOrDefault(p => !File.Exists("/usr/bin/" + p) && !File.Exists("/bin/" + p)) is { } missing
        )
        {
            Skip = $"needs {missing} (apt-get install it)";
        }
    }
}
