using System.Globalization;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SortRig.Engine.Announcing;
using SortRig.Engine.Composition;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Engine.Typed;
using SortRig.Host.Live;
using SortRig.Host.Operator;
using SortRig.Instruments.Drivers;
using SortRig.Instruments.Resources;
using Spectre.Console;

namespace SortRig.Host.Hosting;

/// <summary>
/// The hosted worker of the sort verb: runs one session, shows the live view (or plain lines),
/// prints the summary and stops the application with an exit code.
/// </summary>
internal sealed class SortWorker(
    IOptions<SortOptions> options,
    TimeProvider time,
    BenchEventHub hub,
    BenchSnapshot snapshot,
    OperatorCommands commands,
    TypedEntries typedEntries,
    IConfiguration configuration,
    ILoggerFactory loggers,
    IHostApplicationLifetime lifetime
) : BackgroundService
{
    /// <summary>0 finished, 1 failed, 2 the batch cannot be measured as asked, 130 stopped by Ctrl+C
    /// (resumable).</summary>
    public int ExitCode { get; private set; }

    /// <summary>Longest wait, after the session ended, for the live view to draw what a slow terminal has not yet
    /// shown.</summary>
    private static readonly TimeSpan s_viewCatchUp = TimeSpan.FromSeconds(20);

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var sort = options.Value;
        var typed = ResourceStringParser.IsTyped(sort.Resource);
        // A typed meter runs in prompt mode: plain lines and a prompt, no live view redrawing under the typing.
        var live =
            !typed && (sort.Live ?? (!Console.IsOutputRedirected && AnsiConsole.Profile.Capabilities.Interactive));
        var announcers = new List<IAnnouncer>();
        if (!live)
        {
            announcers.Add(new PlainTextAnnouncer(Console.Out));
        }

        if (sort.Speech)
        {
            announcers.Add(new SpeechAnnouncer(loggers.CreateLogger<SpeechAnnouncer>()));
        }

        var services = new SortServices(time, hub, snapshot, commands, new CompositeAnnouncer(announcers), loggers);
        using var viewStop = CancellationTokenSource.CreateLinkedTokenSource(stoppingToken);
        var view =
            live ? LiveView.RunAsync(AnsiConsole.Console, hub, sort.Parts, viewStop.Token)
            : typed ? Task.CompletedTask // the typed prompt owns the console
            : PlainBuildLines.RunAsync(hub, Console.Out, viewStop.Token);
        try
        {
            var outcome = typed
                ? await TypedConsole
                    .RunAsync(
                        sort,
                        services,
                        typedEntries,
                        Console.In,
                        Console.Out,
                        endWithInput: !configuration.GetValue<bool>("Web:Enabled"),
                        stoppingToken
                    )
                    .ConfigureAwait(false)
                : await SortRunner.RunAsync(sort, services, null, stoppingToken).ConfigureAwait(false);

            // A terminal that reads slowly leaves the view behind the session: let it catch up with the events still
            // queued, up to the end of the session (it stops there by itself), so its last frame counts what the log
            // holds; it is cut off only when the terminal takes longer than s_viewCatchUp (20 s).
            if (live && snapshot.Session is { Finished: true })
            {
                await Task.WhenAny(view, Task.Delay(s_viewCatchUp, stoppingToken)).ConfigureAwait(false);
            }

            await viewStop.CancelAsync().ConfigureAwait(false);
            await view.ConfigureAwait(false);
            SortSummary.Write(AnsiConsole.Console, outcome, snapshot);
            BuildSummary.Write(AnsiConsole.Console, outcome, sort.Session);
        }
        catch (SortPlanException e)
        {
            ExitCode = 2;
            AnsiConsole.MarkupLine($"[red]cannot sort this batch:[/] {Markup.Escape(e.Message)}");
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
            // Ctrl+C or SIGTERM: everything announced is already committed; the part in the fixture is measured again.
            ExitCode = ResumeHint.Interrupted;
            await StopViewAsync(viewStop, view).ConfigureAwait(false);
            var recorded = snapshot.Parts().Count(p => p.State is "Accepted" or "Announced");
            // Plain lines, never wrapped: the resume command must survive a copy and paste.
            await Console
                .Out.WriteLineAsync(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"stopped: session '{sort.Session}' keeps its {recorded} logged part(s); a part still in the "
                            + $"fixture was not recorded and is measured again."
                    )
                )
                .ConfigureAwait(false);
            await Console
                .Out.WriteLineAsync(
                    $"to go on: {ResumeHint.Command(Environment.GetCommandLineArgs()[1..], sort.Session)}"
                )
                .ConfigureAwait(false);
        }
        catch (MeterUnreachableException e)
        {
            // Nothing was measured against this meter yet; the same command runs the session once it is reachable.
            ExitCode = 1;
            Log.SortFailed(loggers.CreateLogger<SortWorker>(), e.Message, e);
            await StopViewAsync(viewStop, view).ConfigureAwait(false);
            AnsiConsole.MarkupLine($"[red]sorting stopped:[/] {Markup.Escape(e.Message)}");
        }
        catch (MeterUnreadableException e)
        {
            // Nothing is wrong with the session: it carries on once the meter gives readings again.
            ExitCode = 1;
            Log.SortFailed(loggers.CreateLogger<SortWorker>(), e.Message, e);
            await StopViewAsync(viewStop, view).ConfigureAwait(false);
            AnsiConsole.MarkupLine($"[red]sorting stopped:[/] {Markup.Escape(e.Message)}");
            await Console
                .Out.WriteLineAsync(
                    $"to go on: {ResumeHint.Command(Environment.GetCommandLineArgs()[1..], sort.Session)}"
                )
                .ConfigureAwait(false);
        }
        catch (Exception e)
        {
            ExitCode = 1;
            Log.SortFailed(loggers.CreateLogger<SortWorker>(), e.Message, e);
            AnsiConsole.MarkupLine($"[red]sorting stopped:[/] {Markup.Escape(e.Message)}");
        }
        finally
        {
            await StopViewAsync(viewStop, view).ConfigureAwait(false);
            if (live)
            {
                AnsiConsole.Cursor.Show(); // the live view hides it; never leave the terminal without one
            }
        }

        if (sort.StayAfterFinish && ExitCode == 0)
        {
            // The page keeps showing the finished session until the operator stops the program.
            await Task.Delay(Timeout.InfiniteTimeSpan, stoppingToken)
                .ContinueWith(_ => { }, TaskScheduler.Default)
                .ConfigureAwait(false);
        }

        lifetime.StopApplication();
    }

    private static async Task StopViewAsync(CancellationTokenSource viewStop, Task view)
    {
        await viewStop.CancelAsync().ConfigureAwait(false);
        try
        {
            await view.ConfigureAwait(false);
        }
        catch (OperationCanceledException)
        {
            // The view ends on cancellation; nothing to report.
        }
    }
}
