using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Drivers;

/// <summary>
/// One meter kept usable across faults, shared by the sorting and drift jobs. Opens a connection through the caller's
/// connect (transport, SCPI session, model check), identifies the instrument on the first connection when asked,
/// applies <see cref="Setup"/>, and closes a half-opened connection when any of that fails. After a fault the job
/// drops the connection (<see cref="DropAsync"/>); the next use opens a fresh one with the same setup. Not
/// thread-safe: one job owns it.
/// </summary>
public sealed class ResilientMeter : IAsyncDisposable
{
    private readonly Func<CancellationToken, Task<IResistanceMeter>> _connect;
    private readonly bool _identify;

    /// <param name="connect">Opens a fresh connection (called again after every drop).</param>
    /// <param name="setup">Range, NPLC and wiring applied on every connection.</param>
    /// <param name="identify">Read the identity on the first connection (the sorting batch records it).</param>
    public ResilientMeter(Func<CancellationToken, Task<IResistanceMeter>> connect, ResistanceSetup setup, bool identify)
    {
        _connect = connect ?? throw new ArgumentNullException(nameof(connect));
        Setup = setup ?? throw new ArgumentNullException(nameof(setup));
        _identify = identify;
    }

    /// <summary>The setup applied on every connection; change it, then <see cref="ApplyAsync"/>, to switch
    /// range.</summary>
    public ResistanceSetup Setup { get; set; }

    /// <summary>The identity read on the first connection ("maker model s/n serial fw firmware"); empty before, or when
    /// not asked.</summary>
    public string Identity { get; private set; } = "";

    /// <summary>True once a connection has been opened and set up; a link that fails after that was lost, not
    /// unreachable.</summary>
    public bool HasConnected { get; private set; }

    /// <summary>The open connection; null before the first use and after a drop.</summary>
    public IResistanceMeter? Current { get; private set; }

    /// <summary>The open connection, or a fresh one (identified once, configured) when there is none.</summary>
    public async Task<IResistanceMeter> GetAsync(CancellationToken ct) =>
        Current ??= await OpenAsync(ct).ConfigureAwait(false);

    /// <summary>
    /// <see cref="GetAsync"/> until it succeeds, waiting with <paramref name="backoff"/> between attempts: every fault
    /// a reconnect cures, and a setup read-back that differs (or a model that does not match, possibly a reply garbled
    /// on the way or a reset between the commands and the read-back) up to <see cref="MeterFaults.SetupRetries"/> times
    /// in a row; then it is a configuration mistake and is thrown. Before any connection existed, a link that cannot be
    /// opened at all (<see cref="InstrumentLinkException.OpenFailed"/>) <see cref="MeterFaults.FirstConnectAttempts"/>
    /// times in a row throws <see cref="MeterUnreachableException"/>: a meter never reached is a setup to check, not
    /// a fault to wait out.
    /// </summary>
    /// <param name="backoff">Waits between attempts.</param>
    /// <param name="time">Clock of the waits.</param>
    /// <param name="onRetry">Told each failure and the wait before the next attempt.</param>
    /// <param name="ct">Stops the attempts.</param>
    public async Task<IResistanceMeter> ConnectWithRetryAsync(
        Backoff backoff,
        TimeProvider time,
        Func<Exception, TimeSpan, CancellationToken, ValueTask> onRetry,
        CancellationToken ct
    )
    {
        ArgumentNullException.ThrowIfNull(backoff);
        ArgumentNullException.ThrowIfNull(onRetry);
        var wait = backoff.First;
        var mismatches = 0;
        var unopened = 0;
        var waited = TimeSpan.Zero;
        while (true)
        {
            ct.ThrowIfCancellationRequested();
            try
            {
                return await GetAsync(ct).ConfigureAwait(false);
            }
            catch (Exception e) when (!ct.IsCancellationRequested && MeterFaults.IsRetryable(e, setupMayRetry: true))
            {
                mismatches = e is InstrumentSetupException ? mismatches + 1 : 0;
                if (mismatches > MeterFaults.SetupRetries)
                {
                    throw;
                }

                unopened = e is InstrumentLinkException { OpenFailed: true } && !HasConnected ? unopened + 1 : 0;
                if (unopened >= MeterFaults.FirstConnectAttempts)
                {
                    throw new MeterUnreachableException(unopened, waited, (InstrumentLinkException)e);
                }

                await onRetry(e, wait, ct).ConfigureAwait(false);
                await Task.Delay(wait, time, ct).ConfigureAwait(false);
                waited += wait;
                wait = backoff.Next(wait);
            }
        }
    }

    /// <summary>Applies <see cref="Setup"/> to the open connection (with its read-back); no-op without one.</summary>
    public async Task ApplyAsync(CancellationToken ct)
    {
        if (Current is { } meter)
        {
            await meter.ConfigureAsync(Setup, ct).ConfigureAwait(false);
        }
    }

    /// <summary>True when there is an open connection and the meter still has <see cref="Setup"/> (no reset under
    /// us).</summary>
    public async Task<bool> VerifyAsync(CancellationToken ct) =>
        Current is { } meter && await meter.VerifySetupAsync(ct).ConfigureAwait(false);

    /// <summary>Closes the open connection, if any; the next use opens a fresh one.</summary>
    public async Task DropAsync()
    {
        if (Current is { } meter)
        {
            Current = null;
            await meter.DisposeAsync().ConfigureAwait(false);
        }
    }

    /// <summary>Closes the open connection; a second call does nothing.</summary>
    public async ValueTask DisposeAsync() => await DropAsync().ConfigureAwait(false);

    private async Task<IResistanceMeter> OpenAsync(CancellationToken ct)
    {
        var meter = await _connect(ct).ConfigureAwait(false);
        try
        {
            if (_identify && Identity.Length == 0)
            {
                Identity = (await meter.IdentifyAsync(ct).ConfigureAwait(false)).ToString();
            }

            await meter.ConfigureAsync(Setup, ct).ConfigureAwait(false);
            HasConnected = true;
            return meter;
        }
        catch
        {
            await meter.DisposeAsync().ConfigureAwait(false);
            throw;
        }
    }
}
