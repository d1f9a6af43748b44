namespace SortRig.Simulator.Meter;

/// <summary>
/// The trigger system and reading memory: INITiate runs TRIGger:COUNt triggers, each taking
/// SAMPle:COUNt readings of the routed input (or of every channel in the scan list), in the
/// background on the bench clock. FETCh? waits for the result.
/// </summary>
internal sealed partial class Acquisition
{
    private readonly MeasurementEngine _engine;
    private readonly MeterState _state;
    private readonly Lock _gate = new();
    private Task<IReadOnlyList<double>>? _run;
    private CancellationTokenSource? _cts;
    private TaskCompletionSource? _trigger;
    private TaskCompletionSource _blockedOnBus = NewSignal();

    public Acquisition(MeasurementEngine engine, MeterState state) => (_engine, _state) = (engine, state);

    public bool IsRunning
    {
        get
        {
            lock (_gate)
            {
                return _run is { IsCompleted: false };
            }
        }
    }

    /// <summary>INITiate: starts a run, or returns the error that stops it.</summary>
    public ScpiError? Start(CancellationToken lifetime)
    {
        var settings = _state.Settings;
        var targets = _state.ScanList.Count > 0 ? _state.ScanList.Cast<int?>().ToArray() : [_state.ClosedChannel];
        if ((long)settings.TriggerCount * settings.SampleCount * targets.Length > MeterSettings.ReadingBuffer)
        {
            return ScpiError.TooMuchData;
        }

        CancellationTokenSource cts;
        lock (_gate)
        {
            if (_run is { IsCompleted: false })
            {
                return ScpiError.InitIgnored;
            }

            _cts?.Dispose();
            _cts = cts = CancellationTokenSource.CreateLinkedTokenSource(lifetime);
            _blockedOnBus = NewSignal();
        }

        // Started outside the lock: the run registers its first timer synchronously (virtual-time tests rely on it).
        var run = RunAsync(settings, targets, _state.ScanList.Count > 0, cts.Token);
        lock (_gate)
        {
            _run = run;
        }

        return null;
    }

    /// <summary>*TRG / bus trigger: releases a run waiting for it; otherwise -211.</summary>
    public ScpiError? Trigger()
    {
        lock (_gate)
        {
            var waiting = _trigger;
            if (waiting is null || !waiting.TrySetResult())
            {
                return ScpiError.TriggerIgnored;
            }

            _trigger = null;
            _blockedOnBus = NewSignal();
            return null;
        }
    }

    /// <summary>FETCh?: the readings of the last run; -230 with none, -214 when the run waits for a bus
    /// trigger.</summary>
    public async Task<(IReadOnlyList<double>? Readings, ScpiError? Error)> FetchAsync(CancellationToken ct)
    {
        Task<IReadOnlyList<double>>? run;
        Task blocked;
        lock (_gate)
        {
            (run, blocked) = (_run, _blockedOnBus.Task);
        }

        if (run is null)
        {
            return (null, ScpiError.DataStale);
        }

        var first = await Task.WhenAny(run, blocked).WaitAsync(ct).ConfigureAwait(false);
        if (first != run)
        {
            return (null, ScpiError.TriggerDeadlock);
        }

        return run.IsCompletedSuccessfully ? (run.Result, null) : (null, ScpiError.DataStale);
    }

    /// <summary>*OPC? / *WAI: waits until no run is measuring (a run parked on a bus trigger counts as idle).</summary>
    public async Task WaitIdleAsync(CancellationToken ct)
    {
        Task? run;
        Task blocked;
        lock (_gate)
        {
            (run, blocked) = (_run, _blockedOnBus.Task);
        }

        if (run is not null)
        {
            await Task.WhenAny(run, blocked).WaitAsync(ct).ConfigureAwait(false);
        }
    }

    /// <summary>ABORt, *RST, CONFigure: stops a run and forgets the reading memory.</summary>
    public void Abort()
    {
        CancellationTokenSource? cts;
        lock (_gate)
        {
            cts = _cts;
            _trigger?.TrySetCanceled();
            (_run, _trigger) = (null, null);
            _blockedOnBus = NewSignal();
        }

        try
        {
            cts?.Cancel();
        }
        catch (ObjectDisposedException)
        {
            // A newer run already replaced it.
        }
    }
}
