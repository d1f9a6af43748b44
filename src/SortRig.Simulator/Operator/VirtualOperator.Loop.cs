using MathNet.Numerics.Distributions;
using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Operator;

/// <summary>Starting, stopping and the auto loop.</summary>
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

    private async Task RunAsync(CancellationToken stop)
    {
        try
        {
            while (!stop.IsCancellationRequested)
            {
                int index;
                CancellationTokenSource cycle;
                lock (_gate)
                {
                    if (_next >= _reel.Count)
                    {
                        _state = OperatorState.Finished;
                        _logger.ReelFinished(_reel.Count);
                        return;
                    }

                    index = _next;
                    _cycle?.Dispose();
                    _cycle = cycle = CancellationTokenSource.CreateLinkedTokenSource(stop);
                }

                try
                {
                    await CycleAsync(index, cycle.Token).ConfigureAwait(false);
                }
                catch (OperationCanceledException) when (!stop.IsCancellationRequested)
                {
                    // SkipTo: put the part back and carry on from the new index.
                    if (_fixture.Occupant?.Index == index)
                    {
                        _fixture.Remove();
                    }
                }
            }
        }
        catch (OperationCanceledException) when (stop.IsCancellationRequested)
        {
            // StopAsync.
        }
        catch (Exception ex) when (ex is InvalidOperationException or ArgumentException)
        {
            _logger.OperatorFailed(ex);
        }
    }

    private async Task CycleAsync(int index, CancellationToken ct)
    {
        SetState(OperatorState.Handling);
        var handling = Uniform(_options.HandlingTimeMin, _options.HandlingTimeMax);
        var warm = ContinuousUniform.Sample(_rng, _options.WarmKelvinMin, _options.WarmKelvinMax);
        await Task.Delay(handling, _time, ct).ConfigureAwait(false);

        if (_fixture.Remove() is SimulatedPart foreign)
        {
            _logger.ForeignPartRemoved(foreign.Index);
        }

        Task announced;
        lock (_gate)
        {
            ct.ThrowIfCancellationRequested();
            _fixture.Insert(_reel[index], warm);
            _announced = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
            announced = _announced.Task;
            _state = OperatorState.Inserted;
        }

        _logger.PartInserted(index, warm);
        var dwell = Task.Delay(_options.MaxDwell, _time, ct);
        var first = await Task.WhenAny(announced, dwell).ConfigureAwait(false);
        await first.ConfigureAwait(false); // throws when the dwell was cancelled by SkipTo or StopAsync
        lock (_gate)
        {
            ct.ThrowIfCancellationRequested();
            _fixture.Remove();
            _next = _next == index ? index + 1 : _next;
            _state = OperatorState.Reacting;
        }

        Interlocked.Increment(ref _partsDone);
        if (first == dwell)
        {
            Interlocked.Increment(ref _dwellTimeouts);
        }

        _logger.PartRemoved(index, first == announced);
        await Task.Delay(Uniform(_options.ReactionTimeMin, _options.ReactionTimeMax), _time, ct).ConfigureAwait(false);
    }

    private TimeSpan Uniform(TimeSpan min, TimeSpan max) =>
        min == max ? min : TimeSpan.FromTicks((long)ContinuousUniform.Sample(_rng, min.Ticks, max.Ticks));

    private void SetState(OperatorState state)
    {
        lock (_gate)
        {
            _state = state;
        }
    }
}
