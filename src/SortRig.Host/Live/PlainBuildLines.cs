using SortRig.Engine.Events;

namespace SortRig.Host.Live;

/// <summary>
/// Without the live view (--plain, redirected output): the build's guidance while sorting toward sets
/// (sort --recipe), printed as "build: ..." each time it changes, so a plain log says what to feed next too.
/// </summary>
internal static class PlainBuildLines
{
    /// <summary>The prefix of each printed line.</summary>
    public const string Prefix = "build: ";

    /// <summary>Prints until <paramref name="cancellationToken"/> stops it.</summary>
    public static async Task RunAsync(BenchEventHub hub, TextWriter output, CancellationToken cancellationToken)
    {
        string? last = null;
        try
        {
            await foreach (var e in hub.SubscribeAsync(includeHistory: false, cancellationToken).ConfigureAwait(false))
            {
                if (e.Kind == BenchEventKind.Notice && e.State == "build" && e.Text is { } text && text != last)
                {
                    last = text;
                    await output.WriteLineAsync(Prefix + text).ConfigureAwait(false);
                }
            }
        }
        catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
        {
            // the session ended: the build summary follows
        }
    }
}
