using System.Globalization;
using SortRig.Engine.DriftLogging;
using SortRig.Measurement.Drift;
using Spectre.Console;

namespace SortRig.Host.Live;

/// <summary>Prints a drift run's outcome: counts, then drift, tempco and short-term ADEV per channel.</summary>
internal static class DriftSummary
{
    public static void Write(IAnsiConsole console, DriftSettings settings, DriftOutcome outcome)
    {
        console.MarkupLine(
            string.Create(
                CultureInfo.InvariantCulture,
                $"drift run [bold]{outcome.RunId}[/] '{Markup.Escape(settings.RunName)}': {outcome.Scans} scans, "
                    + $"{outcome.SamplesStored} samples stored, "
                    + $"{outcome.Gaps} gaps, {outcome.SkippedTicks} scan times skipped, {outcome.Overloads} overloads"
            )
        );
        var table = new Table().AddColumns(
            "channel",
            "samples",
            "drift ppm/h",
            "drift at const. T ppm/h",
            "tempco ppm/K",
            "ADEV at tau0 ppm"
        );
        for (var i = 0; i < outcome.Channels.Count; i++)
        {
            var c = outcome.Channels[i];
            var part =
                i < settings.Channels.Count && settings.LibraryParts.TryGetValue(settings.Channels[i], out var id)
                    ? string.Create(CultureInfo.InvariantCulture, $" part #{id}")
                    : "";
            table.AddRow(
                Markup.Escape(c.Label + part),
                c.Count.ToString(CultureInfo.InvariantCulture),
                Coefficient(c.Drift?.PpmPerHour),
                Coefficient(c.Joint?.PpmPerHour),
                c.Joint is null ? Markup.Escape(c.JointNote ?? "") : Coefficient(c.Joint.PpmPerKelvin),
                c.Adev.Count > 0 ? (c.Adev[0].Deviation * 1e6).ToString("0.000", CultureInfo.InvariantCulture) : ""
            );
        }

        console.Write(table);
        console.MarkupLine(
            $"report: [bold]sortrig report --db "
                + $"{Markup.Escape(SortRig.Storage.Lab.ConnectionText.Mask(settings.Database))} --drift-run "
                + $"{outcome.RunId} --out report-drift-{outcome.RunId}[/]"
        );
    }

    private static string Coefficient(Coefficient? c) =>
        c is { } v
            ? string.Create(CultureInfo.InvariantCulture, $"{v.Value:+0.0000;-0.0000} ± {v.StandardError:0.0000}")
            : "";
}
