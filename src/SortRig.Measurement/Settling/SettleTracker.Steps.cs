using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Settling;

/// <summary>The settling and removal steps of the settle rule.</summary>
public sealed partial class SettleTracker
{
    private SettleVerdict Settle(Reading reading, bool overload)
    {
        if (overload)
        {
            _overloadRun++;
            if (_overloadRun >= _options.RemovalOverloads)
            {
                return Removed(reading);
            }

            return TimedOut(reading)
                ? Unstable(reading, UnstableReason.IntermittentContact)
                : Verdict(SettleState.Settling, reading);
        }

        if (_overloadRun > 0)
        {
            // An overload flicker between finite readings: the contact changed, so start the window again.
            _flickers++;
            _overloadRun = 0;
            _window.Clear();
            _noise.Clear();
            _residual.Clear();
            _predictive?.Clear();
            _collected = 0;
            _stats = null;
        }

        _latestValue = reading.Value;
        _collected++;
        _window.Enqueue(reading);
        _noise.Add(reading.Value);
        _residual.Add(reading, _options.WindowLength);
        _predictive?.Add(reading);
        if (_window.Count > _options.WindowLength)
        {
            _window.Dequeue();
        }

        var window = _window.ToArray();
        _stats = WindowStatistics.Of(window, _criticalT) is { } raw
            ? raw with
            {
                Sem = Math.Max(raw.Sem, _noise.Sigma / Math.Sqrt(window.Length)),
            }
            : null;
        if (
            _collected >= _options.RequiredReadings
            && _window.Count == _options.WindowLength
            && _stats is { } s
            && Judge(s, window, out var residual)
        )
        {
            var value = ResistanceUncertainty.For(
                window,
                _range,
                _nplc,
                _options.SpecPeriod,
                _options.FourWire,
                _options.Model
            );
            var acceptance = new SettleAcceptance(
                ResidualSettling.Widen(value, residual),
                window,
                reading.Time - _insertedAt!.Value,
                residual
            );
            var verdict = Verdict(SettleState.Accepted, reading) with { Acceptance = acceptance };
            _state = SettleState.AwaitingRemoval;
            // The averaging rule's part teaches the prior only through a fit of its own record that is good.
            Prior = _predictive is null ? Prior : Prior.Learn(_predictive.Latest);
            return verdict;
        }

        if (_predictive?.TryAccept(_options.Target) is { } fit)
        {
            return AcceptPredicted(reading, window, fit);
        }

        return TimedOut(reading) ? Unstable(reading, ReasonForFailure()) : Verdict(SettleState.Settling, reading);
    }

    /// <summary>
    /// Accepts the fit's final value: the meter's terms for one reading (spec, resolution, short-term stability, lead)
    /// plus the fit's standard uncertainty, in quadrature (GUM 5.1.2); the fit replaces the window's Type A.
    /// </summary>
    private SettleVerdict AcceptPredicted(Reading reading, Reading[] window, RecoveryFit fit)
    {
        var meter = ResistanceUncertainty.For(
            [reading],
            _range,
            _nplc,
            _options.SpecPeriod,
            _options.FourWire,
            _options.Model
        );
        var u = fit.StandardUncertainty;
        var value = meter with
        {
            Value = fit.FinalValue,
            StandardUncertainty = Math.Sqrt((meter.StandardUncertainty * meter.StandardUncertainty) + (u * u)),
            TransferUncertainty = Math.Sqrt((meter.TransferUncertainty * meter.TransferUncertainty) + (u * u)),
        };
        var acceptance = new SettleAcceptance(
            value,
            window,
            reading.Time - _insertedAt!.Value,
            0,
            SettleRule.Predictive,
            fit
        );
        var verdict = Verdict(SettleState.Accepted, reading) with { Acceptance = acceptance };
        _state = SettleState.AwaitingRemoval;
        Prior = Prior.Learn(fit);
        return verdict;
    }

    /// <summary>Judges a full window; counts why it failed, for the reason given on timeout. Gives the residual
    /// half-width, ohms.</summary>
    private bool Judge(WindowStatistics s, Reading[] window, out double residual)
    {
        var target = _options.Target.InOhms(s.Mean);
        residual = _residual.HalfWidth(s, _criticalT, window);
        if (_residual.SpanMode)
        {
            // A slope may be detectable yet harmless: what must be small is the excess it implies. The bound a
            // (with its t·SE(b) term) takes the place of the slope test and of the excursion limit.
            if (residual > target)
            {
                _slopeFailures++;
                return false;
            }

            if (s.Sem > target)
            {
                _noiseFailures++;
                return false;
            }

            // A step of the part's level inside the span (popcorn) can flatten the line against a recovery still
            // under way: the span restarts after it, and the bound is read again from the readings after the step.
            if (_residual.RestartAfterStep(_options.SlopeAlpha))
            {
                residual = _residual.HalfWidth(s, _criticalT, window);
                if (residual > target)
                {
                    _slopeFailures++;
                    return false;
                }
            }

            return true;
        }

        if (s.SlopeSignificant)
        {
            _slopeFailures++;
            return false;
        }

        // An insignificant slope whose estimate is still too large means the noise hides any drift: noise failure.
        if (s.Excursion > _options.SlopeFractionOfTarget * target || s.Sem > target)
        {
            _noiseFailures++;
            return false;
        }

        return true;
    }

    private UnstableReason ReasonForFailure()
    {
        if (_flickers > 0)
        {
            return UnstableReason.IntermittentContact;
        }

        if (_slopeFailures + _noiseFailures == 0)
        {
            return UnstableReason.TooFewReadings;
        }

        return _slopeFailures >= _noiseFailures ? UnstableReason.DriftingSlope : UnstableReason.NoisySem;
    }

    private bool TimedOut(Reading reading) => reading.Time - _insertedAt!.Value - _excused > _options.MaxSettleTime;

    private SettleVerdict Unstable(Reading reading, UnstableReason reason)
    {
        var verdict = Verdict(SettleState.Unstable, reading) with
        {
            Failure = new SettleFailure(reason, reading.Time - _insertedAt!.Value),
        };
        _state = SettleState.AwaitingRemoval;
        _overloadRun = 0;
        return verdict;
    }

    private SettleVerdict AwaitRemoval(Reading reading, bool overload)
    {
        if (!overload)
        {
            _overloadRun = 0;
            _latestValue = reading.Value;
            return Verdict(SettleState.AwaitingRemoval, reading);
        }

        _overloadRun++;
        return _overloadRun >= _options.RemovalOverloads
            ? Removed(reading)
            : Verdict(SettleState.AwaitingRemoval, reading);
    }

    private SettleVerdict Removed(Reading reading)
    {
        var verdict = Verdict(SettleState.Removed, reading);
        ClearPart();
        _state = SettleState.Empty;
        _insertedAt = null;
        return verdict;
    }

    private void ClearPart()
    {
        _window.Clear();
        _noise.Clear();
        _residual.Clear();
        _predictive?.Clear();
        _stats = null;
        _latestValue = null;
        _collected = 0;
        _overloadRun = 0;
        _flickers = 0;
        _slopeFailures = 0;
        _noiseFailures = 0;
        _restartOnNextReading = false;
        _excused = TimeSpan.Zero;
    }
}
