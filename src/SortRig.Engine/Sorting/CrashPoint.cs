using System.Diagnostics;

namespace SortRig.Engine.Sorting;

/// <summary>
/// Test hook for the crash tests, off by default. When the environment variable
/// <c>SORTRIG_CRASH_AT</c> is <c>point:n</c>, the process kills itself with SIGKILL the n-th time
/// (1-based, counted in this process) the sorting loop passes that point. Points:
/// <c>read</c> (a part settled and checked, not yet committed), <c>commit</c> (committed, not yet
/// announced), <c>announce</c> (announced, not yet marked announced in the log), <c>bridge</c> (a range
/// transfer's bridging part read on both ranges, the correction not yet recorded) and <c>bridged</c>
/// (the correction recorded, not yet announced), <c>check</c> (a check read and judged, not yet recorded) and
/// <c>checked</c> (recorded with its flags, not yet acted on).
/// Unset, empty or malformed: no effect.
/// </summary>
internal static class CrashPoint
{
    /// <summary>The environment variable read once at start.</summary>
    public const string Variable = "SORTRIG_CRASH_AT";

    private static readonly (CrashSite Point, int Count)? s_armed = Parse(Environment.GetEnvironmentVariable(Variable));
    private static int s_passed;

    /// <summary>Called by the loop at each point; returns unless this is the armed point's n-th pass.</summary>
    public static void Pass(CrashSite point)
    {
        if (s_armed is not { } armed || armed.Point != point || Interlocked.Increment(ref s_passed) != armed.Count)
        {
            return;
        }

        using var self = Process.GetCurrentProcess();
        self.Kill(); // SIGKILL on Unix: no finally blocks, no flush, like a power cut to the process
        Environment.FailFast($"{Variable}={Name(point)}:{armed.Count}");
    }

    /// <summary>The point and count of a <c>point:n</c> value; null when unset, empty or malformed (names are lower
    /// case).</summary>
    internal static (CrashSite Point, int Count)? Parse(string? value)
    {
        var parts = value?.Split(':') ?? [];
        return parts.Length == 2 && Site(parts[0]) is { } site && int.TryParse(parts[1], out var n) && n > 0
            ? (site, n)
            : null;
    }

    /// <summary>The name a point has in <c>SORTRIG_CRASH_AT</c>.</summary>
    internal static string Name(CrashSite site) => site.ToString().ToLowerInvariant();

    private static CrashSite? Site(string name) =>
        Enum.GetValues<CrashSite>().Select(s => (CrashSite?)s).FirstOrDefault(s => Name(s!.Value) == name);
}
