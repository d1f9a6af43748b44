using System.Globalization;
using SortRig.Planning.Assembly;
using Spectre.Console;

namespace SortRig.Host.PlanVerb;

/// <summary>Shows the set search's progress on a long run (the result line is Engine's AssemblySummary).</summary>
internal sealed class SearchProgress(IAnsiConsole console) : IProgress<AssemblyProgress>
{
    // Passes on a small session finish in milliseconds; only show progress once the search has run a while.
    private static readonly TimeSpan s_quiet = TimeSpan.FromSeconds(1);

    public void Report(AssemblyProgress value)
    {
        if (value.Elapsed >= s_quiet)
        {
            console.MarkupLine(
                Markup.Escape(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"  searching: {value.Phase}, {value.Sets} set(s), upper bound {value.UpperBound}, "
                            + $"{value.Elapsed.TotalSeconds:0.0} s"
                    )
                )
            );
        }
    }
}
