using SortRig.Instruments.Profiles;
using SortRig.Instruments.Scpi;
using SortRig.Measurement.Readings;

namespace SortRig.Instruments.Drivers;

/// <summary>A resistance meter driven through a profile. One caller at a time per operation sequence.</summary>
public interface IResistanceMeter : IAsyncDisposable
{
    /// <summary>The profile the meter is driven by.</summary>
    MeterProfile Profile { get; }

    /// <summary>Asks the meter who it is (*IDN?).</summary>
    Task<InstrumentIdentity> IdentifyAsync(CancellationToken ct);

    /// <summary>
    /// Sends the profile's configure, range, NPLC and trigger templates, checks the error queue,
    /// reads range and NPLC back, and after a range change waits the profile's settle time.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">Range, NPLC or wiring is not in the profile.</exception>
    /// <exception cref="ScpiInstrumentException">The meter reported an error.</exception>
    /// <exception cref="InstrumentSetupException">The read-back differs from the request.</exception>
    Task ConfigureAsync(ResistanceSetup setup, CancellationToken ct);

    /// <summary>Takes one triggered reading; 9.9E37 gives <see cref="Reading.Overload"/>. Timestamped from the injected
    /// clock.</summary>
    /// <exception cref="InvalidOperationException">Not configured yet.</exception>
    Task<Reading> ReadAsync(CancellationToken ct);

    /// <summary>Reads each scanner channel once, in the order given (for drift logging).</summary>
    /// <exception cref="NotSupportedException">The profile has no scanner commands.</exception>
    Task<IReadOnlyList<Reading>> ReadChannelsAsync(IReadOnlyList<int> channels, CancellationToken ct);

    /// <summary>Reads range and NPLC back; false when they differ from the last setup (e.g. the meter was reset) or
    /// none was made.</summary>
    Task<bool> VerifySetupAsync(CancellationToken ct);
}
