using SortRig.Simulator.Faults;
using SortRig.Simulator.Meter;
using SortRig.Simulator.Scpi;

namespace SortRig.Simulator.Serving;

/// <summary>
/// The instrument as its connections see it: one program message at a time across all
/// connections (a meter has one parser), with message faults applied before each message.
/// </summary>
internal sealed class ScpiDevice : IDisposable
{
    private readonly SemaphoreSlim _gate = new(1, 1);
    private readonly ScpiDispatcher _dispatcher;

    public ScpiDevice(DeviceContext context)
    {
        Context = context;
        _dispatcher = new ScpiDispatcher(CommandTree.Build(), context);
    }

    public DeviceContext Context { get; }

    public FaultInjector Faults => Context.Faults;

    /// <summary>Runs one program message; returns the reply line body, or null when it has no reply.</summary>
    public async Task<string?> ExecuteAsync(
        string message,
        ScpiSession session,
        Action<FaultKind>? onFault,
        CancellationToken ct
    )
    {
        await _gate.WaitAsync(ct).ConfigureAwait(false);
        try
        {
            foreach (var fault in Faults.TakeMessageFaults())
            {
                onFault?.Invoke(fault);
                if (fault == FaultKind.SpuriousError)
                {
                    Context.PushError(ScpiError.SystemError);
                }
                else
                {
                    Context.Reset();
                }
            }

            return await _dispatcher.ExecuteAsync(message, session, ct).ConfigureAwait(false);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>Records an error found by the transport (-363, -410, -420).</summary>
    public void PushError(ScpiError error) => Context.PushError(error);

    public void Dispose() => _gate.Dispose();
}
