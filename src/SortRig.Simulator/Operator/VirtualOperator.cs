using MathNet.Numerics.Distributions;
using MathNet.Numerics.Random;
using Microsoft.Extensions.Logging;
using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Operator;

/// <summary>
/// The person at the bench. In auto mode: take the next part off the reel, hold it for a random
/// handling time (warming it), insert it, wait for <see cref="OnPartAnnounced"/> or the maximum
/// dwell, remove it, pause a reaction time, repeat. When the reel is used up the fixture stays empty.
/// </summary>
public sealed partial class VirtualOperator
{
    private readonly OperatorOptions _options;
    private readonly IReadOnlyList<SimulatedPart> _reel;
    private readonly Fixture _fixture;
    private readonly TimeProvider _time;
    private readonly ILogger _logger;
    private readonly Random _rng;
    private readonly Lock _gate = new();
    private int _next;
    private OperatorState _state;
    private TaskCompletionSource _announced = new(TaskCreationOptions.RunContinuationsAsynchronously);
    private CancellationTokenSource? _stop;
    private CancellationTokenSource? _cycle;
    private Task _loop = Task.CompletedTask;
    private int _partsDone;
    private int _dwellTimeouts;

    internal VirtualOperator(
        OperatorOptions options,
        IReadOnlyList<SimulatedPart> reel,
        Fixture fixture,
        TimeProvider time,
        int seed,
        ILogger logger
    )
    {
        _options = options.Validate();
        (_reel, _fixture, _time, _logger) = (reel, fixture, time, logger);
        _rng = new MersenneTwister(seed, threadSafe: false);
    }

    /// <summary>What the operator is doing now.</summary>
    public OperatorState State
    {
        get
        {
            lock (_gate)
            {
                return _state;
            }
        }
    }

    /// <summary>Reel index of the part the operator will insert next (equals the reel count when finished).</summary>
    public int NextIndex
    {
        get
        {
            lock (_gate)
            {
                return _next;
            }
        }
    }

    /// <summary>True while the auto loop runs.</summary>
    public bool IsRunning
    {
        get
        {
            lock (_gate)
            {
                return !_loop.IsCompleted;
            }
        }
    }

    /// <summary>Parts inserted and taken out again by the auto loop.</summary>
    public int PartsDone => Volatile.Read(ref _partsDone);

    /// <summary>Parts taken out because the maximum dwell passed without an announcement.</summary>
    public int DwellTimeouts => Volatile.Read(ref _dwellTimeouts);

    /// <summary>
    /// The host has announced the part in the fixture (its cup): the operator takes it out.
    /// Returns false (and does nothing) when no part of the operator's is waiting in the fixture.
    /// </summary>
    public bool OnPartAnnounced()
    {
        lock (_gate)
        {
            return _state == OperatorState.Inserted && _announced.TrySetResult();
        }
    }

    /// <summary>
    /// Resume the reel at <paramref name="reelIndex"/> (0 to reel count): a part in hand or in the
    /// fixture goes back, and the next part inserted is this one. Restarts a finished auto loop.
    /// </summary>
    public void SkipTo(int reelIndex)
    {
        OptionGuard.InRange(reelIndex, 0, _reel.Count, nameof(reelIndex));
        _logger.SkippedTo(reelIndex);
        bool restart;
        CancellationTokenSource? cycle;
        lock (_gate)
        {
            _next = reelIndex;
            cycle = _cycle;
            restart = _stop is { IsCancellationRequested: false } && _loop.IsCompleted;
        }

        // Cancelled outside the lock: the loop's continuation may run on this thread.
        CancelQuietly(cycle);
        if (restart)
        {
            Start();
        }
    }

    private static void CancelQuietly(CancellationTokenSource? source)
    {
        try
        {
            source?.Cancel();
        }
        catch (ObjectDisposedException)
        {
            // The cycle ended and was replaced meanwhile; the new cycle reads the new index.
        }
    }
}
