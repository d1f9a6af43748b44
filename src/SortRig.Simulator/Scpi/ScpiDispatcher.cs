using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Scpi;

/// <summary>
/// Executes one program message: each unit in turn, relative header paths resolved, errors pushed
/// to the queue. A command error (-1xx) discards the rest of the message; an execution error does not.
/// Replies of the queries in the message are joined with ';' into one line.
/// </summary>
internal sealed class ScpiDispatcher
{
    private readonly CommandTable _table;
    private readonly DeviceContext _device;

    public ScpiDispatcher(CommandTable table, DeviceContext device) => (_table, _device) = (table, device);

    public async Task<string?> ExecuteAsync(string message, ScpiSession session, CancellationToken ct)
    {
        session.ResetPath();
        var replies = new List<string>();
        try
        {
            foreach (var text in MessageParser.SplitUnits(message))
            {
                if (text.Trim().Length == 0)
                {
                    continue;
                }

                var error = await ExecuteUnitAsync(text, session, replies, ct).ConfigureAwait(false);
                if (error is ScpiError e && e.Code is <= -100 and > -200)
                {
                    break;
                }
            }
        }
        catch (ScpiException ex)
        {
            _device.PushError(ex.Error);
        }

        return replies.Count > 0 ? string.Join(';', replies) : null;
    }

    private async Task<ScpiError?> ExecuteUnitAsync(
        string text,
        ScpiSession session,
        List<string> replies,
        CancellationToken ct
    )
    {
        try
        {
            var unit = MessageParser.ParseUnit(text);
            var (command, tokens) = Resolve(unit, session);
            if (unit.Parameters.Count < command.MinParameters)
            {
                throw new ScpiException(ScpiError.MissingParameter);
            }

            if (unit.Parameters.Count > command.MaxParameters)
            {
                throw new ScpiException(ScpiError.ParameterNotAllowed);
            }

            if (!unit.IsCommon)
            {
                session.Advance(tokens);
            }

            var reply = await command.Handler(new ScpiCall(unit, _device, session), ct).ConfigureAwait(false);
            if (command.IsQuery && reply is not null)
            {
                replies.Add(reply);
            }

            return null;
        }
        catch (ScpiException ex)
        {
            _device.PushError(ex.Error);
            return ex.Error;
        }
        catch (InvalidOperationException)
        {
            // e.g. the operator put a part in the fixture between the check and the insert.
            _device.PushError(ScpiError.SettingsConflict);
            return ScpiError.SettingsConflict;
        }
        catch (ArgumentException)
        {
            _device.PushError(ScpiError.DataOutOfRange);
            return ScpiError.DataOutOfRange;
        }
    }

    /// <summary>Tries the header below the current path first, then from the root (lenient, like most
    /// meters).</summary>
    private (ScpiCommand Command, IReadOnlyList<string> Tokens) Resolve(ProgramUnit unit, ScpiSession session)
    {
        ScpiError? firstError = null;
        if (!unit.IsCommon && !unit.Rooted && session.Path.Count > 0)
        {
            var relative = session.Path.Concat(unit.Nodes).ToArray();
            var found = _table.Find(relative, unit.IsQuery, out firstError);
            if (found is not null)
            {
                return (found, relative);
            }
        }

        var command = _table.Find(unit.Nodes, unit.IsQuery, out var error);
        return command is not null
            ? (command, unit.Nodes)
            : throw new ScpiException(
                (error == ScpiError.UndefinedHeader ? firstError : null) ?? error ?? ScpiError.UndefinedHeader
            );
    }
}
