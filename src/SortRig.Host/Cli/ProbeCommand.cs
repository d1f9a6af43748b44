using System.CommandLine;
using SortRig.Engine.Composition;
using SortRig.Instruments;
using SortRig.Instruments.Drivers;
using SortRig.Instruments.Scpi;
using SortRig.Instruments.Transports;
using Spectre.Console;

namespace SortRig.Host.Cli;

/// <summary>The probe verb: identify a meter and check that a profile fits it.</summary>
internal static class ProbeCommand
{
    public static Command Create()
    {
        var command = new Command(
            "probe",
            "Connect to a meter, identify it and check that a profile fits (ranges, NPLC, commands, error queue). "
                + "Run it after any change to a profile's command templates, before wiring parts (docs/safety.md)."
        );
        var resource = new Option<string>("--resource")
        {
            Description = "Meter resource, e.g. TCPIP::127.0.0.1::5025::SOCKET",
            Required = true,
        };
        var profile = new Option<string>("--profile")
        {
            Description = "Profile name under instruments/ or a YAML file",
            DefaultValueFactory = _ => "simulator",
        };
        command.Add(resource);
        command.Add(profile);
        command.SetAction(
            (result, ct) => RunAsync(result.GetValue(resource)!, result.GetValue(profile)!, AnsiConsole.Console, ct)
        );
        return command;
    }

    public static async Task<int> RunAsync(
        string resource,
        string profileName,
        IAnsiConsole console,
        CancellationToken ct
    )
    {
        try
        {
            var profile = ProfileLocator.Load(profileName);
            var connector = new MeterConnector(new MessageLinkFactory());
            await using var session = await connector.OpenSessionAsync(resource, profile, ct).ConfigureAwait(false);
            var report = await new ProfileCheck().RunAsync(session, profile, ct).ConfigureAwait(false);
            var table = new Table()
                .Border(TableBorder.Rounded)
                .Title($"{Shown(report.Family)} at {Shown(report.Endpoint)}");
            table.AddColumn("check");
            table.AddColumn("outcome");
            table.AddColumn("detail");
            foreach (var row in report.Rows)
            {
                var colour = row.Outcome switch
                {
                    CheckOutcome.Pass => "green",
                    CheckOutcome.Fail => "red",
                    _ => "yellow",
                };
                table.AddRow(Shown(row.Check), $"[{colour}]{row.Outcome}[/]", Shown(row.Detail));
            }

            console.Write(table);
            console.MarkupLine(report.Passed ? "[green]profile fits[/]" : "[red]profile does not fit[/]");
            return report.Passed ? 0 : 1;
        }
        catch (Exception e) when (e is InstrumentException or FileNotFoundException)
        {
            console.MarkupLine($"[red]probe failed:[/] {Shown(e.Message)}");
            return 2;
        }
    }

    // Meter replies may carry control characters that a terminal would obey; show them as \xNN.
    private static string Shown(string text) => Markup.Escape(ReplyText.Printable(text));
}
