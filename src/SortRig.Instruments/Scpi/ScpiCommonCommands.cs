namespace SortRig.Instruments.Scpi;

/// <summary>IEEE 488.2 common commands (sec. 10) on a <see cref="ScpiSession"/>.</summary>
public static class ScpiCommonCommands
{
    /// <summary>*IDN? — manufacturer, model, serial and firmware (IEEE 488.2 sec. 10.14).</summary>
    public static async Task<InstrumentIdentity> IdentifyAsync(this ScpiSession session, CancellationToken ct) =>
        InstrumentIdentity.Parse(await session.QueryAsync("*IDN?", ct).ConfigureAwait(false));

    /// <summary>*RST then *OPC? — resets to defaults and waits until the reset is done (sec. 10.32, 10.19).</summary>
    /// <param name="session">The session.</param>
    /// <param name="timeout">Time allowed for the reset to finish; reset can be slow.</param>
    /// <param name="ct">Caller cancellation.</param>
    public static async Task ResetAsync(this ScpiSession session, TimeSpan timeout, CancellationToken ct)
    {
        await session.WriteAsync("*RST", ct).ConfigureAwait(false);
        await session.WaitOperationCompleteAsync(timeout, ct).ConfigureAwait(false);
    }

    /// <summary>*CLS — clears the status registers and the error queue (sec. 10.3).</summary>
    public static Task ClearStatusAsync(this ScpiSession session, CancellationToken ct) =>
        session.WriteAsync("*CLS", ct);

    /// <summary>*OPC? — waits until pending operations finish; the instrument answers "1" (sec. 10.19).</summary>
    /// <exception cref="ScpiResponseException">The reply is not 1.</exception>
    public static async Task WaitOperationCompleteAsync(
        this ScpiSession session,
        TimeSpan timeout,
        CancellationToken ct
    )
    {
        var reply = await session.QueryAsync("*OPC?", timeout, ct).ConfigureAwait(false);
        if (!ScpiNumber.TryParse(reply, out var n) || n.Value != 1)
        {
            throw new ScpiResponseException("*OPC?", reply, "1");
        }
    }

    /// <summary>*ESR? — reads and clears the Standard Event Status Register (sec. 10.12, 11.5.1).</summary>
    /// <exception cref="ScpiResponseException">The reply is not an integer 0-255.</exception>
    public static async Task<StandardEvents> ReadEventStatusAsync(this ScpiSession session, CancellationToken ct)
    {
        var reply = await session.QueryAsync("*ESR?", ct).ConfigureAwait(false);
        return ScpiNumber.TryParse(reply, out var n) && n.Format == ScpiNumberFormat.NR1 && n.Value is >= 0 and <= 255
            ? (StandardEvents)(int)n.Value
            : throw new ScpiResponseException("*ESR?", reply, "an integer 0-255 (NR1)");
    }
}
