using SortRig.Measurement.Readings;
using SortRig.Simulator.Meter;

namespace SortRig.Bench.Settling;

/// <summary>
/// One simulated insertion of a part into the fixture, read by a free-running meter: apertures back to back,
/// the k-th ending at (phase + k) × period after contact. Readings come from the simulator's own fixture
/// (Newton cooling, tempco, contact bounce) and meter conversion (noise, quantisation, over-range), generated
/// on demand; beside each reading, the noise-free value the part presented at that instant.
/// </summary>
/// <param name="Index">Reel index.</param>
/// <param name="WarmKelvin">Handling warmth at contact, K.</param>
/// <param name="TempcoPpmPerKelvin">The part's tempco.</param>
/// <param name="Truth">True value settled at the ambient (the simulator's truth side channel), ohms.</param>
/// <param name="InsertedAt">Instant of contact on the virtual clock.</param>
/// <param name="Period">Time per reading (aperture with autozero + overhead).</param>
/// <param name="Phase">Where in its aperture the meter was at contact, 0..1.</param>
/// <param name="Range">Full scale of the locked range, ohms.</param>
/// <param name="Read">The simulator's reading at a time since contact (ohms or 9.9E37); draws one noise value per
/// call.</param>
/// <param name="Presented">The noise-free value the part presents at a time since contact, ohms.</param>
internal sealed record Insertion(
    int Index,
    double WarmKelvin,
    double TempcoPpmPerKelvin,
    double Truth,
    DateTimeOffset InsertedAt,
    TimeSpan Period,
    double Phase,
    double Range,
    Func<TimeSpan, double> Read,
    Func<TimeSpan, double> Presented
)
{
    private readonly List<Reading> _readings = [];
    private readonly List<double> _clean = [];

    /// <summary>Time from contact to the end of aperture k.</summary>
    public TimeSpan Since(int k) => TimeSpan.FromTicks((long)Math.Round((Phase + k) * Period.Ticks));

    /// <summary>Reading k (0 = the first aperture ending after contact).</summary>
    public Reading Reading(int k)
    {
        Ensure(k);
        return _readings[k];
    }

    /// <summary>Noise-free value presented at the end of aperture k, ohms.</summary>
    public double Clean(int k)
    {
        Ensure(k);
        return _clean[k];
    }

    /// <summary>Index of the first aperture ending at or after the given time since contact.</summary>
    public int FirstEndingAtOrAfter(TimeSpan since) =>
        Math.Max(0, (int)Math.Ceiling((since.Ticks / (double)Period.Ticks) - Phase - 1e-9));

    private void Ensure(int k)
    {
        while (_readings.Count <= k)
        {
            var since = Since(_readings.Count);
            var value = Read(since);
            var kind = ReadingModel.IsOverflow(value) ? ReadingKind.Overload : ReadingKind.Finite;
            _readings.Add(new Reading(value, InsertedAt + since, Range, kind));
            _clean.Add(Presented(since));
        }
    }
}
