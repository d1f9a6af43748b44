using SortRig.Engine.Sorting;
using SortRig.Host.PlanVerb;
using Spectre.Console;

namespace SortRig.Host.Live;

/// <summary>After a session that sorted toward a build: the pick list when the sets are in hand, else where it
/// stands.</summary>
internal static class BuildSummary
{
    public static void Write(IAnsiConsole console, SortOutcome outcome, string session)
    {
        if (outcome.Build is not { } build)
        {
            return;
        }

        if (!build.Complete || build.Plan is not { } plan)
        {
            console.MarkupLine($"[yellow]build not complete:[/] {Markup.Escape(build.Line)}");
            return;
        }

        console.MarkupLine($"[green]sets complete:[/] {build.Sets} set(s) of {Markup.Escape(build.RecipeName)}");
        PickListView.Write(console, plan, $"session '{session}'");
        if (build.CsvPath is { } csv)
        {
            console.MarkupLine(Markup.Escape($"pick list written to {csv}"));
        }
    }
}
