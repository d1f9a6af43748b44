using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SortRig.Engine.DriftLogging;
using SortRig.Engine.Events;
using SortRig.Engine.Simulation;
using SortRig.Host.LibraryVerb;
using SortRig.Host.Live;
using SortRig.Host.VerbSupport;
using Spectre.Console;

namespace SortRig.Host.Hosting;

/// <summary>
/// The hosted form of the drift job: runs one drift log (driving the virtual clock when there is one),
/// prints notices (gaps, reconnects) as they come and the analysis at the end, then stops the application.
/// </summary>
internal sealed class DriftWorker(
    IOptions<DriftOptions> options,
    TimeProvider time,
    BenchEventHub hub,
    ILoggerFactory loggers,
    IHostApplicationLifetime lifetime
) : BackgroundService
{
    /// <summary>0 finished or stopped, 1 failed, 2 bad settings (<see cref="VerbExit.BadInput"/>: also a library part
    /// that cannot be logged).</summary>
    public int ExitCode { get; private set; }

    /// <summary>The outcome once the run has ended.</summary>
    public DriftOutcome? Outcome { get; private set; }

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        using var noticesStop = CancellationTokenSource.CreateLinkedTokenSource(stoppingToken);
        var notices = PrintNoticesAsync(noticesStop.Token);
        try
        {
            var settings = options.Value.Validate();
            var services = new DriftServices(time, TimeProvider.System, hub, loggers);
            var run = DriftRunner.RunAsync(settings, services, null, stoppingToken);
            if (time is VirtualClock clock)
            {
                await clock.DriveAsync(run, null, stoppingToken).ConfigureAwait(false);
            }

            Outcome = await run.ConfigureAwait(false);
            await noticesStop.CancelAsync().ConfigureAwait(false);
            await notices.ConfigureAwait(false);
            DriftSummary.Write(AnsiConsole.Console, settings, Outcome);
        }
        catch (ArgumentException e)
        {
            ExitCode = VerbExit.BadInput;
            AnsiConsole.MarkupLine(
                $"[red]cannot log drift with these settings:[/] {Markup.Escape(e.Message.Split(" (Parameter", 2)[0])}"
            );
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
            // Stopped before the run started: nothing was logged.
        }
        catch (Exception e)
        {
            ExitCode = 1;
            Log.DriftFailed(loggers.CreateLogger<DriftWorker>(), e);
            AnsiConsole.MarkupLine($"[red]drift logging stopped:[/] {Markup.Escape(e.Message)}");
        }
        finally
        {
            await noticesStop.CancelAsync().ConfigureAwait(false);
        }

        lifetime.StopApplication();
    }

    private async Task PrintNoticesAsync(CancellationToken ct)
    {
        try
        {
            await foreach (var e in hub.SubscribeAsync(false, ct).ConfigureAwait(false))
            {
                if (e.Kind == BenchEventKind.Notice)
                {
                    AnsiConsole.MarkupLineInterpolated($"[yellow]{e.Time:yyyy-MM-dd HH:mm:ss}[/] {e.Text}");
                }
            }
        }
        catch (OperationCanceledException) when (ct.IsCancellationRequested)
        {
            // The run ended.
        }
    }
}
