using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Operator;

/// <summary>Starting and stopping the auto loop, and manual steps.</summary>
public sealed partial class VirtualOperator
{
    /// <summary>Starts the auto loop from <see cref="NextIndex"/>; does nothing when it already runs.</summary>
    public void Start()
    {
        CancellationTokenSource stop;
        TaskCompletionSource started;
        lock (_gate)
        {
            if (!_loop.IsCompleted)
            {
                return;
            }

            _stop?.Dispose();
            _stop = stop = new CancellationTokenSource();
            started = new TaskCompletionSource();
            _loop = started.Task;
        }

        // Run outside the lock; the first handling timer is registered before Start returns
        // (virtual-time tests rely on it).
        var loop = RunAsync(stop.Token);
        lock (_gate)
        {
            _loop = loop;
        }

        started.SetResult();
    }

    /// <summary>Stops the auto loop; a part in the fixture stays there.</summary>
    public async Task StopAsync()
    {
        Task loop;
        CancellationTokenSource? stop;
        lock (_gate)
        {
            (stop, loop) = (_stop, _loop);
        }

        stop?.Cancel();
        await loop.ConfigureAwait(false);
        lock (_gate)
        {
            _state = OperatorState.Idle;
        }
    }

    /// <summary>Manual step (side channel): inserts the next reel part; null when the reel is used up.</summary>
    internal SimulatedPart? InsertNext(double warmKelvin)
    {
        lock (_gate)
        {
            if (!_loop.IsCompleted)
            {
                throw new InvalidOperationException("The operator is feeding parts in auto mode.");
            }

            if (_next >= _reel.Count)
            {
                return null;
            }

            _fixture.Insert(_reel[_next], warmKelvin);
            return _reel[_next++];
        }
    }
}
