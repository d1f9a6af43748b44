using System.CommandLine;
using System.Globalization;
using SortRig.Host.ReportVerb;
using SortRig.Host.VerbSupport;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.Cli;

/// <summary>The report verb: a folder of plots (PNG), CSV files and a markdown summary from the precision
/// log.</summary>
internal static class ReportCommand
{
    public static Command Create()
    {
        var command = new Command(
            "report",
            "Write a report folder (histograms per nominal, drift and Allan deviation plots, CSV, summary.md) from "
                + "the log."
        );
        var db = new Option<string>("--db")
        {
            Description = "SQLite file or PostgreSQL connection string (default sortrig.db)",
            DefaultValueFactory = _ => "sortrig.db",
        };
        var session = new Option<string?>("--session")
        {
            Description = "Session name (the newest with that name) or id: reel histograms",
        };
        var run = new Option<long?>("--drift-run") { Description = "Drift run id: drift and Allan deviation plots" };
        var output = new Option<string>("--out")
        {
            Description = "Report folder (default report)",
            DefaultValueFactory = _ => "report",
        };
        var cups = new Option<int?>("--cups")
        {
            Description = "Cups of the sort, for band edges (default: inferred from the recorded cups)",
        };
        command.Add(db);
        command.Add(session);
        command.Add(run);
        command.Add(output);
        var force = new Option<bool>("--force") { Description = "Replace the report already in the --out folder" };
        command.Add(cups);
        command.Add(force);
        command.SetAction(
            (result, ct) =>
                RunAsync(
                    new ReportRequest(
                        result.GetValue(db)!,
                        result.GetValue(output)!,
                        result.GetValue(session),
                        result.GetValue(run),
                        result.GetValue(cups),
                        result.GetValue(force)
                    ),
                    AnsiConsole.Console,
                    ct
                )
        );
        return command;
    }

    /// <summary>Writes the report and prints the files; 0 written, 2 bad request, 1 storage failure.</summary>
    public static async Task<int> RunAsync(ReportRequest request, IAnsiConsole console, CancellationToken ct)
    {
        ReportResult result;
        try
        {
            result = await ReportRunner.RunAsync(request, TimeProvider.System, null, ct).ConfigureAwait(false);
        }
        catch (ArgumentException e)
        {
            console.MarkupLine($"[red]report:[/] {Markup.Escape(e.Message.Split(" (Parameter", 2)[0])}");
            return 2;
        }
        catch (VerbException e)
        {
            console.MarkupLine($"[red]report:[/] {Markup.Escape(e.Message)}");
            return 2;
        }
        catch (StorageException e)
        {
            console.MarkupLine($"[red]report:[/] {Markup.Escape(e.Message)}");
            return 1;
        }

        var table = new Table().AddColumns("file", "bytes", "holds");
        foreach (var file in result.Files)
        {
            var size = new FileInfo(Path.Combine(result.Folder, file)).Length;
            table.AddRow(
                Markup.Escape(file),
                size.ToString(CultureInfo.InvariantCulture),
                Markup.Escape(Describe(file))
            );
        }

        console.MarkupLine($"report written to [bold]{Markup.Escape(result.Folder)}[/]");
        console.Write(table);
        foreach (var note in result.Notes)
        {
            console.MarkupLine($"[yellow]note:[/] {Markup.Escape(note)}");
        }

        return 0;
    }

    private static string Describe(string file) =>
        file switch
        {
            _ when file.EndsWith("_bins.csv", StringComparison.Ordinal) => "histogram bin counts",
            _ when file.StartsWith("histogram_", StringComparison.Ordinal) =>
                "parts per ppm bin, tolerance and band edges",
            _ when file.StartsWith("drift_", StringComparison.Ordinal)
                    && file.EndsWith(".png", StringComparison.Ordinal) => "ppm vs hours, temperature on the right axis",
            _ when file.StartsWith("adev_", StringComparison.Ordinal) => "overlapping Allan deviation, log-log",
            "summary.md" => "counts, statistics, drift, tempco, ADEV",
            _ => "CSV data",
        };
}
