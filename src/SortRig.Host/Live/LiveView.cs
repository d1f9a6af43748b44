using System.Threading.Channels;
using SortRig.Engine.Announcing;
using SortRig.Engine.Events;
using SortRig.Measurement.Readings;
using Spectre.Console;
using Spectre.Console.Rendering;

namespace SortRig.Host.Live;

/// <summary>
/// The large, plain live console view: reel progress, the current cup in big letters with value
/// and deviation, the current reading and settle state, and cup counts.
/// </summary>
internal static class LiveView
{
    public static async Task RunAsync(
        IAnsiConsole console,
        BenchEventHub hub,
        int partsPlanned,
        CancellationToken cancellationToken
    )
    {
        var latest = LiveViewModel.Empty(partsPlanned);
        var pacer = new FramePacer(TimeProvider.System);

        // Two loops: one folds every event into the model and never touches the terminal, the other draws the
        // latest model when the pacer says a frame is due. A terminal that reads slowly holds up only the drawing:
        // the model stays current, and the frame drawn after a slow write is the newest state, not a queued one.
        var dirty = Channel.CreateBounded<bool>(
            new BoundedChannelOptions(1) { FullMode = BoundedChannelFullMode.DropWrite }
        );
        var folding = Task.Run(
            async () =>
            {
                try
                {
                    await foreach (
                        var e in hub.SubscribeAsync(includeHistory: true, cancellationToken).ConfigureAwait(false)
                    )
                    {
                        var next = latest.Apply(e);
                        Volatile.Write(ref latest, next);
                        if (pacer.Due(e.Kind))
                        {
                            dirty.Writer.TryWrite(true);
                        }

                        if (next.Finished)
                        {
                            break;
                        }
                    }
                }
                catch (OperationCanceledException)
                {
                    // The session ended or was stopped; the last frame shows what was folded.
                }
                finally
                {
                    dirty.Writer.TryComplete();
                }
            },
            CancellationToken.None
        );

        await console
            .Live(Render(latest))
            .AutoClear(false)
            .StartAsync(async context =>
            {
                LiveViewModel? drawn = null;
                while (await dirty.Reader.WaitToReadAsync(CancellationToken.None).ConfigureAwait(false))
                {
                    dirty.Reader.TryRead(out _);
                    drawn = Volatile.Read(ref latest);
                    context.UpdateTarget(Render(drawn));
                }

                await folding.ConfigureAwait(false);
                var last = Volatile.Read(ref latest);
                if (!ReferenceEquals(last, drawn))
                {
                    context.UpdateTarget(Render(last)); // the latest state, not the last frame drawn
                }
            })
            .ConfigureAwait(false);
    }

    public static IRenderable Render(LiveViewModel m)
    {
        var progress =
            m.PartsPlanned > 0
                ? new BreakdownChart()
                    .Width(60)
                    .AddItem("done", m.PartsDone, Color.Green)
                    .AddItem("to go", Math.Max(0, m.PartsPlanned - m.PartsDone), Color.Grey)
                : (IRenderable)new Markup($"[bold]{m.PartsDone}[/] parts");
        var cup = m.LastAnnouncement is { } a
            ? new Rows(
                new FigletText(a.Cup ?? "?").Color(a.Cup == "R" ? Color.Red : Color.Yellow),
                new Markup(
                    $"[bold]part {a.PartNumber}[/]   {Markup.Escape(OhmsText.Format(a.Value ?? double.NaN))}   "
                        + $"{Markup.Escape(OhmsText.Ppm(a.DeviationPpm ?? double.NaN))}"
                )
            )
            : (IRenderable)new Markup("[grey]waiting for the first part[/]");
        var reading = m.LastReading is { } r
            ? new Markup(
                $"[bold]{Markup.Escape(OhmsText.Format(r.Value ?? double.PositiveInfinity))}[/]  "
                    + $"{Markup.Escape(r.State ?? "")}  {Markup.Escape(r.Text ?? "")}"
            )
            : new Markup("[grey]no reading yet[/]");
        var counts = new Table().Border(TableBorder.Rounded);
        foreach (var label in m.Counts.Keys.Order(StringComparer.Ordinal))
        {
            counts.AddColumn(new TableColumn(label).Centered());
        }

        if (m.Counts.Count > 0)
        {
            counts.AddRow(
                m.Counts.OrderBy(kv => kv.Key, StringComparer.Ordinal)
                    .Select(kv => kv.Value.ToString(System.Globalization.CultureInfo.InvariantCulture))
                    .ToArray()
            );
        }

        var notices = new Rows(m.Notices.Select(n => (IRenderable)new Markup($"[aqua]{Markup.Escape(n)}[/]")));
        return new Rows(
            new Panel(progress).Header("reel"),
            new Panel(cup).Header("cup"),
            new Panel(reading).Header("fixture"),
            m.Counts.Count > 0 ? counts : new Text(""),
            m.LastCheck is { } check
                ? new Markup(
                    check.Contains("out of control", StringComparison.Ordinal)
                        ? $"[bold red]{Markup.Escape(check)}[/]"
                        : $"[green]{Markup.Escape(check)}[/]"
                )
                : new Text(""),
            notices,
            new Markup(
                "[grey]keys: U undo last · M measure again · P pause · F finish · R measure flagged parts again[/]"
            )
        );
    }
}
