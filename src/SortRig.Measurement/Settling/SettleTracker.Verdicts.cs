using SortRig.Measurement.Readings;

namespace SortRig.Measurement.Settling;

/// <summary>Input checks and verdict construction of the settle rule.</summary>
public sealed partial class SettleTracker
{
    /// <summary>Checks a reading and says whether it is an overload.</summary>
    private bool Validate(Reading reading)
    {
        if (_lastTime is { } last && reading.Time < last)
        {
            throw new ArgumentException(
                $"Reading at {reading.Time:O} is older than the previous one at {last:O}; readings must arrive in "
                    + $"time order.",
                nameof(reading)
            );
        }

        if (reading.Range > 0 && Math.Abs(reading.Range - _range.FullScale) > 1e-6 * _range.FullScale)
        {
            throw new ArgumentException(
                $"Reading at {reading.Time:O} was taken on the {reading.Range:G6} ohm range; this tracker judges the "
                    + $"{_range.FullScale:G6} ohm range.",
                nameof(reading)
            );
        }

        var overload = reading.Kind == ReadingKind.Overload || Math.Abs(reading.Value) >= Reading.ScpiOverflow;
        if (!overload && !double.IsFinite(reading.Value))
        {
            throw new ArgumentException(
                $"Reading at {reading.Time:O} is marked finite but its value is {reading.Value}.",
                nameof(reading)
            );
        }

        return overload;
    }

    private SettleVerdict Verdict(SettleState state, Reading reading)
    {
        double? slopePpm = null,
            semOhms = null,
            semPpm = null,
            target = null;
        if (_stats is { } s && s.Mean != 0)
        {
            slopePpm = s.Slope / Math.Abs(s.Mean) * 1e6;
            semOhms = s.Sem;
            semPpm = s.Sem / Math.Abs(s.Mean) * 1e6;
        }

        if (_latestValue is { } latest)
        {
            target = _options.Target.InOhms(_stats?.Mean ?? latest);
        }

        var elapsed = _insertedAt is { } inserted && reading.Time >= inserted ? reading.Time - inserted : TimeSpan.Zero;
        var live = new SettleLive(
            reading.Time,
            _latestValue,
            slopePpm,
            semOhms,
            semPpm,
            target,
            elapsed,
            _collected,
            _flickers
        );
        return new SettleVerdict(state, live);
    }
}
