using System.Threading.Channels;

namespace SortRig.Engine.Operator;

/// <summary>The queue of operator actions, fed by the keyboard and the web page, read by the sorting loop.</summary>
public sealed class OperatorCommands
{
    private readonly Channel<OperatorCommand> _channel = Channel.CreateUnbounded<OperatorCommand>(
        new UnboundedChannelOptions { SingleReader = true }
    );

    /// <summary>Queues an action.</summary>
    public void Post(OperatorCommand command) => _channel.Writer.TryWrite(command);

    /// <summary>Takes a queued action if there is one.</summary>
    public bool TryTake(out OperatorCommand command) => _channel.Reader.TryRead(out command);

    /// <summary>Waits for the next action.</summary>
    public ValueTask<OperatorCommand> TakeAsync(CancellationToken cancellationToken) =>
        _channel.Reader.ReadAsync(cancellationToken);

    /// <summary>Maps a key to an action: U undo, M measure again, P or space pause, F finish, R measure the flagged
    /// parts again.</summary>
    public static OperatorCommand? FromKey(char key) =>
        char.ToUpperInvariant(key) switch
        {
            'U' => OperatorCommand.UndoLast,
            'M' => OperatorCommand.Remeasure,
            'P' or ' ' => OperatorCommand.TogglePause,
            'F' => OperatorCommand.Finish,
            'R' => OperatorCommand.RemeasureFlagged,
            _ => null,
        };
}
