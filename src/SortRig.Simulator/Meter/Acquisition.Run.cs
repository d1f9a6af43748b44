namespace SortRig.Simulator.Meter;

/// <summary>The background run: triggers, channels and samples on a schedule.</summary>
internal sealed partial class Acquisition
{
    /// <summary>Readings follow a schedule on the bench clock: each aperture starts when the previous one
    /// ended.</summary>
    private async Task<IReadOnlyList<double>> RunAsync(
        MeterSettings settings,
        int?[] targets,
        bool scanning,
        CancellationToken ct
    )
    {
        var readings = new List<double>();
        var duration = _engine.ReadingDuration(settings);
        var cursor = _engine.Now;
        for (var t = 0; t < settings.TriggerCount; t++)
        {
            if (settings.TriggerSource == TriggerSource.Bus)
            {
                await WaitForBusTriggerAsync(ct).ConfigureAwait(false);
                cursor = _engine.Now > cursor ? _engine.Now : cursor;
            }

            foreach (var target in targets)
            {
                if (scanning)
                {
                    _state.ClosedChannel = target;
                    cursor += IntegrationTiming.ChannelSwitch;
                }

                for (var s = 0; s < settings.SampleCount; s++)
                {
                    cursor += duration;
                    readings.Add(await _engine.ReadAtAsync(target, cursor, settings, ct).ConfigureAwait(false));
                }
            }
        }

        return readings;
    }

    private Task WaitForBusTriggerAsync(CancellationToken ct)
    {
        lock (_gate)
        {
            _trigger = NewSignal();
            _blockedOnBus.TrySetResult();
            return _trigger.Task.WaitAsync(ct);
        }
    }

    private static TaskCompletionSource NewSignal() => new(TaskCreationOptions.RunContinuationsAsynchronously);
}
