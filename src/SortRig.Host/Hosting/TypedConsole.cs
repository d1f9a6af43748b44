using SortRig.Engine.Composition;
using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Engine.Typed;
using SortRig.Measurement.Settling;

namespace SortRig.Host.Hosting;

/// <summary>
/// Prompt mode of the sort verb for a typed meter: each prompt is printed as a line starting with "? ", and each line
/// the operator types goes to the typed sorting loop. The console is read on its own thread (Console.In blocks);
/// the end of input ends the run, leaving the session resumable.
/// </summary>
internal static class TypedConsole
{
    /// <summary>Runs one typed session on <paramref name="input"/> and <paramref name="output"/>.</summary>
    /// <param name="sort">Session settings with a TYPED resource.</param>
    /// <param name="services">Shared services.</param>
    /// <param name="entries">Where typed lines go (the bench page posts here too).</param>
    /// <param name="input">The console's input.</param>
    /// <param name="output">Where prompts are printed.</param>
    /// <param name="endWithInput">End the run at the end of input; false when the bench page can still type.</param>
    /// <param name="ct">Stops the session; it stays resumable.</param>
    public static async Task<SortOutcome> RunAsync(
        SortOptions sort,
        SortServices services,
        TypedEntries entries,
        TextReader input,
        TextWriter output,
        bool endWithInput,
        CancellationToken ct
    )
    {
        var gate = new Lock();
        void Print(string prompt)
        {
            lock (gate)
            {
                output.WriteLine("? " + prompt);
                output.Flush();
            }
        }

        entries.Prompted += Print;
        using var stop = CancellationTokenSource.CreateLinkedTokenSource(ct);
        var pump = Task.Run(() => PumpAsync(input, entries, endWithInput, stop.Token), CancellationToken.None);
        var forward = Task.Run(
            () => ForwardCommandsAsync(services.Commands, entries, stop.Token),
            CancellationToken.None
        );
        try
        {
            return await TypedRunner
                .RunAsync(
                    sort,
                    services,
                    entries,
                    new HandSettleOptions { Agreeing = sort.Agree, MinGap = TimeSpan.FromSeconds(sort.Gap) },
                    ct
                )
                .ConfigureAwait(false);
        }
        finally
        {
            entries.Prompted -= Print;
            await stop.CancelAsync().ConfigureAwait(false);
            // The reading thread may stay blocked in ReadLine; it is abandoned, never awaited.
            _ = pump;
            await forward.ConfigureAwait(false);
        }
    }

    // The page's buttons (and keys) post operator commands; on a typed meter they become the typed words.
    private static async Task ForwardCommandsAsync(
        OperatorCommands commands,
        TypedEntries entries,
        CancellationToken ct
    )
    {
        try
        {
            while (!ct.IsCancellationRequested)
            {
                var line = await commands.TakeAsync(ct).ConfigureAwait(false) switch
                {
                    OperatorCommand.UndoLast => "undo",
                    OperatorCommand.Remeasure => "again",
                    OperatorCommand.Finish => "finish",
                    _ => null, // pause: nothing runs between entries, so there is nothing to pause
                };
                if (line is not null)
                {
                    await entries.PostAsync(line, ct).ConfigureAwait(false);
                }
            }
        }
        catch (OperationCanceledException) when (ct.IsCancellationRequested)
        {
            // The session ended.
        }
    }

    private static async Task PumpAsync(TextReader input, TypedEntries entries, bool endWithInput, CancellationToken ct)
    {
        try
        {
            while (!ct.IsCancellationRequested)
            {
                var line = await Task.Run(input.ReadLine, CancellationToken.None).WaitAsync(ct).ConfigureAwait(false);
                if (line is null)
                {
                    if (endWithInput)
                    {
                        entries.Complete();
                    }

                    return;
                }

                await entries.PostAsync(line, ct).ConfigureAwait(false);
            }
        }
        catch (OperationCanceledException) when (ct.IsCancellationRequested)
        {
            // The session ended; nothing more to read.
        }
    }
}
