using MathNet.Numerics.Distributions;
using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Operator;

/// <summary>The auto loop: one cycle per part (handle, insert, wait, remove, pause).</summary>
public sealed partial class VirtualOperator
{
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
        var handling = Uniform(_options.HandlingTimeMin, _options.HandlingTimeMax);
        var warm = ContinuousUniform.Sample(_rng, _options.WarmKelvinMin, _options.WarmKelvinMax);

        // Each state is published only after its timer is registered, so whoever sees the state
        // and then advances a virtual clock moves that timer too.
        var handled = Task.Delay(handling, _time, ct);
        SetState(OperatorState.Handling);
        await handled.ConfigureAwait(false);

        if (_fixture.Remove() is SimulatedPart foreign)
        {
            _logger.ForeignPartRemoved(foreign.Index);
        }

        Task announced;
        var dwell = Task.Delay(_options.MaxDwell, _time, ct);
        lock (_gate)
        {
            ct.ThrowIfCancellationRequested();
            _fixture.Insert(_reel[index], warm);
            _announced = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
            announced = _announced.Task;
            _state = OperatorState.Inserted;
        }

        _logger.PartInserted(index, warm);
        var first = await Task.WhenAny(announced, dwell).ConfigureAwait(false);
        await first.ConfigureAwait(false); // throws when the dwell was cancelled by SkipTo or StopAsync
        var reacted = Task.Delay(Uniform(_options.ReactionTimeMin, _options.ReactionTimeMax), _time, ct);
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
        await reacted.ConfigureAwait(false);
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
