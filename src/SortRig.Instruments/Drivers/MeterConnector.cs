using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Instruments.Profiles;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Scpi;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Drivers;

/// <summary>Opens link, SCPI session and meter driver from a resource string and a profile.</summary>
public sealed class MeterConnector
{
    private readonly MessageLinkFactory _links;
    private readonly TimeProvider _time;
    private readonly ILoggerFactory _loggers;

    /// <summary>Creates the connector.</summary>
    /// <param name="links">Opens the links (and resolves SIM resources).</param>
    /// <param name="time">Clock for timeouts, settle waits and reading timestamps; default system.</param>
    /// <param name="loggers">Logger factory; default none.</param>
    public MeterConnector(MessageLinkFactory links, TimeProvider? time = null, ILoggerFactory? loggers = null)
    {
        _links = links ?? throw new ArgumentNullException(nameof(links));
        _time = time ?? TimeProvider.System;
        _loggers = loggers ?? NullLoggerFactory.Instance;
    }

    /// <summary>Opens a SCPI session to the meter at <paramref name="resource"/> with the profile's terminator and
    /// timeout.</summary>
    /// <exception cref="ResourceStringException">The resource string is malformed.</exception>
    /// <exception cref="InstrumentSetupException">The profile does not allow the resource's transport.</exception>
    /// <exception cref="InstrumentLinkException">The link could not be opened.</exception>
    public async Task<ScpiSession> OpenSessionAsync(string resource, MeterProfile profile, CancellationToken ct)
    {
        var parsed = ResourceStringParser.Parse(resource);
        if (!profile.Comms.Transports.Contains(parsed.Transport))
        {
            throw new InstrumentSetupException(
                "transport",
                $"one of {string.Join(", ", profile.Comms.Transports)} (profile '{profile.Family}')",
                $"{parsed.Transport} ({resource})"
            );
        }

        var link = await _links
            .OpenAsync(parsed, new MessageLinkOptions(profile.Comms.Terminator), profile.Comms.Serial, ct)
            .ConfigureAwait(false);
        return new ScpiSession(
            link,
            new ScpiSessionOptions(profile.Comms.QueryTimeout),
            _time,
            _loggers.CreateLogger<ScpiSession>()
        );
    }

    /// <summary>Opens the meter and, when <paramref name="checkIdentity"/>, checks its *IDN? model against the
    /// profile.</summary>
    /// <exception cref="InstrumentSetupException">Transport not allowed, or the model does not match the
    /// profile.</exception>
    public async Task<IResistanceMeter> ConnectAsync(
        string resource,
        MeterProfile profile,
        bool checkIdentity,
        CancellationToken ct
    )
    {
        var session = await OpenSessionAsync(resource, profile, ct).ConfigureAwait(false);
        var meter = new ScpiResistanceMeter(session, profile, _time, _loggers.CreateLogger<ScpiResistanceMeter>());
        try
        {
            if (checkIdentity)
            {
                var identity = await meter.IdentifyAsync(ct).ConfigureAwait(false);
                if (!profile.MatchesModel(identity.Model))
                {
                    throw new InstrumentSetupException(
                        "model",
                        $"a match for /{profile.ModelPattern}/ (profile '{profile.Family}')",
                        $"'{identity.Model}'"
                    );
                }
            }

            return meter;
        }
        catch
        {
            await meter.DisposeAsync().ConfigureAwait(false);
            throw;
        }
    }
}
