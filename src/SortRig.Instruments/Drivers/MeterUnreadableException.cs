using SortRig.Instruments.Scpi;

namespace SortRig.Instruments.Drivers;

/// <summary>
/// The meter answered <see cref="Count"/> reading requests in a row with something that is not a reading
/// (the SCPI not-a-number value, or text), though the connection and its setup were fine each time: a reconnect
/// does not cure it, so the job stops and says what the meter sent.
/// </summary>
public sealed class MeterUnreadableException : InstrumentException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="count">Replies in a row that were not a reading.</param>
    /// <param name="lastReply">The last such reply, as received.</param>
    /// <param name="innerException">The last reply's fault.</param>
    public MeterUnreadableException(int count, string lastReply, Exception? innerException = null)
        : base(
            $"the meter answered {count} reading requests in a row with '{Shown(lastReply)}' instead of a reading; "
                + "check its function, range and input terminals, then resume the session",
            innerException
        )
    {
        Count = count;
        LastReply = lastReply;
    }

    /// <summary>Replies in a row that were not a reading.</summary>
    public int Count { get; }

    /// <summary>The last such reply, as received.</summary>
    public string LastReply { get; }

    // Control characters escaped (a terminal would obey them), cut at 40 characters.
    private static string Shown(string reply)
    {
        var text = ReplyText.Printable(reply ?? "");
        return text.Length <= 40 ? text : string.Concat(text.AsSpan(0, 40), "...");
    }
}
