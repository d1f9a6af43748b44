using System.Globalization;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Specs;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Settling;

/// <summary>
/// The settle rule for people reading a display: a part is accepted when K entries in a row, each at least
/// <see cref="HandSettleOptions.MinGap"/> after the one before, agree within <see
/// cref="HandSettleOptions.AgreeCounts"/> digits. A part warming in the fingers reads higher or lower each time; the
/// operator is asked to let go, wait and read again. Times come from the readings (the caller stamps them with its
/// TimeProvider). One instance per part at a time; <see cref="Reset"/> before the next part. Not thread-safe.
/// </summary>
public sealed class HandSettle
{
    private readonly List<Reading> _entries = [];
    private readonly DisplayRange _range;
    private readonly HandSettleOptions _options;
    private bool _done;

    /// <param name="range">The range set on the meter; its step is the resolution the entries must agree to.</param>
    /// <param name="options">Default <see cref="HandSettleOptions.Default"/>.</param>
    public HandSettle(DisplayRange range, HandSettleOptions? options = null)
    {
        _range = range ?? throw new ArgumentNullException(nameof(range));
        _options = options ?? HandSettleOptions.Default;
        if (_options.MaxEntries < _options.Agreeing)
        {
            throw new ArgumentOutOfRangeException(
                nameof(options),
                _options.MaxEntries,
                "MaxEntries must be at least Agreeing."
            );
        }
    }

    /// <summary>Entries counted for the present part.</summary>
    public IReadOnlyList<Reading> Entries => _entries;

    /// <summary>Judges one typed entry (a finite reading, not older than the last).</summary>
    /// <exception cref="ArgumentException">Not finite, or older than the previous entry.</exception>
    /// <exception cref="InvalidOperationException">The part was already decided; call <see cref="Reset"/>.</exception>
    public HandSettleVerdict Add(Reading entry)
    {
        if (_done)
        {
            throw new InvalidOperationException("This part is decided; Reset before the next part.");
        }

        if (!entry.IsFinite || !double.IsFinite(entry.Value))
        {
            throw new ArgumentException("A typed entry must be a finite value.", nameof(entry));
        }

        if (_entries.Count > 0)
        {
            var gap = entry.Time - _entries[^1].Time;
            if (gap < TimeSpan.Zero)
            {
                throw new ArgumentException("An entry must not be older than the previous one.", nameof(entry));
            }

            if (gap < _options.MinGap)
            {
                return new HandSettleVerdict(
                    HandSettleState.TooSoon,
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"that was only {gap.TotalSeconds:0.0} s after the last entry, not counted: let go of the "
                            + $"part, wait {_options.MinGap.TotalSeconds:0.#} s, read again"
                    ),
                    _entries.Count
                );
            }
        }

        _entries.Add(entry);
        var k = _options.Agreeing;
        if (_entries.Count < k)
        {
            return new HandSettleVerdict(
                HandSettleState.Confirming,
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"got {_range.Show(entry.Value)} ({_entries.Count} of {k}): let go of the part, wait a few "
                        + $"seconds, read again"
                ),
                _entries.Count
            );
        }

        var last = _entries.Skip(_entries.Count - k).Select(r => r.Value).ToArray();
        var spread = last.Max() - last.Min();
        if (spread <= (_options.AgreeCounts + 1e-6) * _range.Step)
        {
            _done = true;
            var value = DisplayUncertainty.For(_range, last.Average());
            return new HandSettleVerdict(
                HandSettleState.Accepted,
                string.Create(CultureInfo.InvariantCulture, $"accepted {_range.Show(value.Value)}"),
                _entries.Count,
                value,
                [.. _entries]
            );
        }

        var previous = _entries[^2].Value;
        if (_entries.Count >= _options.MaxEntries)
        {
            _done = true;
            return new HandSettleVerdict(
                HandSettleState.Unstable,
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"still moving after {_entries.Count} readings ({_range.Show(_entries.Min(r => r.Value))} to "
                        + $"{_range.Show(_entries.Max(r => r.Value))}): set the part aside to cool and measure it later"
                ),
                _entries.Count,
                null,
                [.. _entries]
            );
        }

        return new HandSettleVerdict(
            HandSettleState.Moving,
            string.Create(
                CultureInfo.InvariantCulture,
                $"the reading moved from {_range.Show(previous)} to {_range.Show(entry.Value)}: let go of the part, "
                    + $"wait a few seconds, read again"
            ),
            _entries.Count
        );
    }

    /// <summary>Forgets the present part's entries (the next part, or the operator starting the part over).</summary>
    public void Reset()
    {
        _entries.Clear();
        _done = false;
    }
}
