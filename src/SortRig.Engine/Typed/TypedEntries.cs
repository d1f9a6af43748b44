using System.Threading.Channels;

namespace SortRig.Engine.Typed;

/// <summary>
/// Lines the operator types (console or bench page), in order, to the one typed sorting loop; and the prompt the
/// loop shows now. Lossless: a line waits until the loop reads it. <see cref="Complete"/> marks the end of input.
/// </summary>
public sealed class TypedEntries
{
    private readonly Channel<string> _lines = Channel.CreateBounded<string>(
        new BoundedChannelOptions(64) { SingleReader = true, FullMode = BoundedChannelFullMode.Wait }
    );
    private volatile string _prompt = "";

    /// <summary>Raised with each new prompt (the console prints it).</summary>
    public event Action<string>? Prompted;

    /// <summary>What the loop asks for now; empty before the first prompt.</summary>
    public string CurrentPrompt => _prompt;

    /// <summary>Queues one typed line, waiting while 64 lines are unread.</summary>
    public ValueTask PostAsync(string line, CancellationToken cancellationToken) =>
        _lines.Writer.WriteAsync(line ?? "", cancellationToken);

    /// <summary>No more lines will come (end of input); the loop stops when it has read the rest.</summary>
    public void Complete() => _lines.Writer.TryComplete();

    /// <summary>Shows <paramref name="prompt"/> and waits for the next line; null at the end of input.</summary>
    internal async ValueTask<string?> AskAsync(string prompt, CancellationToken ct)
    {
        _prompt = prompt;
        Prompted?.Invoke(prompt);
        while (await _lines.Reader.WaitToReadAsync(ct).ConfigureAwait(false))
        {
            if (_lines.Reader.TryRead(out var line))
            {
                return line;
            }
        }

        return null;
    }
}
