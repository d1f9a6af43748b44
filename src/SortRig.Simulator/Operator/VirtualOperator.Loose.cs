using MathNet.Numerics.Distributions;
using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Operator;

/// <summary>A part the host asks for that is not the next on the reel (a bridging part).</summary>
public sealed partial class VirtualOperator
{
    /// <summary>
    /// Stops feeding reel parts (a reel part in the fixture goes back; <see cref="NextIndex"/> is kept),
    /// handles <paramref name="part"/> for a handling time, warming it like any part, and inserts it.
    /// It stays in the fixture until <see cref="TakeOut"/>; feeding resumes with <see cref="Start"/>.
    /// </summary>
    /// <param name="part">Usually from <see cref="SimulatedBench.TakeLoosePart"/>.</param>
    /// <param name="ct">Stops the handling wait (the part is then not inserted).</param>
    public async Task HandInAsync(SimulatedPart part, CancellationToken ct)
    {
        ArgumentNullException.ThrowIfNull(part);
        await StopAsync().ConfigureAwait(false);
        if (_fixture.Remove() is SimulatedPart back)
        {
            _logger.ForeignPartRemoved(back.Index);
        }

        var handling = Uniform(_options.HandlingTimeMin, _options.HandlingTimeMax);
        var warm = ContinuousUniform.Sample(_rng, _options.WarmKelvinMin, _options.WarmKelvinMax);
        var handled = Task.Delay(handling, _time, ct);
        SetState(OperatorState.Handling);
        await handled.ConfigureAwait(false);
        _fixture.Insert(part, warm);
        SetState(OperatorState.Inserted);
        _logger.PartInserted(part.Index, warm);
    }

    /// <summary>Takes whatever is in the fixture out (state Idle); returns it, or null when it was empty.</summary>
    public SimulatedPart? TakeOut()
    {
        var part = _fixture.Remove();
        SetState(OperatorState.Idle);
        if (part is not null)
        {
            _logger.PartRemoved(part.Index, true);
        }

        return part;
    }
}
