using System.Globalization;
using Spectre.Console;
using SortRig.Planning.Assembly;

namespace SortRig.Host.Planning;

/// <summary>Shows the set search's progress on a long run, and the result's sets, bound, gap, method and tie-break.</summary>
internal sealed class SearchProgress(IAnsiConsole console) : IProgress<AssemblyProgress>
{
    // Passes on a small session finish in milliseconds; only show progress once the search has run a while.
    private static readonly TimeSpan s_quiet = TimeSpan.FromSeconds(1);

    public void Report(AssemblyProgress value)
    {
        if (value.Elapsed >= s_quiet)
        {
            console.MarkupLine(Markup.Escape(string.Create(CultureInfo.InvariantCulture,
                $"  searching: {value.Phase}, {value.Sets} set(s), upper bound {value.UpperBound}, {value.Elapsed.TotalSeconds:0.0} s")));
        }
    }

    /// <summary>"sets 12, upper bound 13, gap 7.7 %, method ..., bound: ..., tie-break: ..., 0.42 s".</summary>
    public static string Summary(AssemblyResult r) => string.Create(CultureInfo.InvariantCulture,
        $"sets {r.Sets.Count}, upper bound {r.UpperBound}, gap {100 * r.Gap:0.0} %{(r.ProvenOptimal ? " (proven optimal)" : "")}, method {r.Method}, " +
        $"bound: {r.BoundMethod}; tie-break: {r.TieBreak}; {r.Elapsed.TotalSeconds:0.00} s");
}
