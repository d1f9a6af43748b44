using System.CommandLine;
using SortRig.Engine.Picking;
using SortRig.Host.LibraryVerb;
using SortRig.Host.PlanVerb;
using SortRig.Host.VerbSupport;
using Spectre.Console;

namespace SortRig.Host.Cli;

/// <summary>Options shared by the plan and library verbs.</summary>
internal static class CliOptions
{
    public static Option<string> Database() =>
        new("--db")
        {
            Description =
                "SQLite file or PostgreSQL connection string (\"Host=...;Database=...\"); default "
                + "SORTRIG_Sort__Database or sortrig.db",
            // --help asks for the default outside any parse (no parent result): it gets the string with its password
            // masked.
            DefaultValueFactory = r =>
                r.Parent is null
                    ? SortRig.Storage.Lab.ConnectionText.Mask(VerbGuard.DefaultDatabase())
                    : VerbGuard.DefaultDatabase(),
        };

    public static Option<string> Recipe() =>
        new("--recipe") { Description = "Recipe file, or a name under recipes/ (e.g. matched-quad)", Required = true };

    public static Option<string> Pick() =>
        new("--pick")
        {
            Description =
                "auto (default): by cup when every part sits in a cup and the recipe is matched; parts: by id; cups: "
                + "by cup and count",
            DefaultValueFactory = _ => "auto",
        };

    public static Option<string> Ids() =>
        new("--ids") { Description = "Part ids, e.g. 3,4,9 or 12-15", Required = true };

    public static PickMode ParsePick(string? text) =>
        (text ?? "auto").Trim().ToLowerInvariant() switch
        {
            "auto" => PickMode.Auto,
            "parts" or "part" => PickMode.Parts,
            "cups" or "cup" => PickMode.Cups,
            _ => throw new VerbException($"--pick: '{text}' is not auto, parts or cups"),
        };
}
