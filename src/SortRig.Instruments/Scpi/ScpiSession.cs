using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Scpi;

/// <summary>
/// SCPI commands and queries over one message link. Safe for concurrent callers: every exchange
/// (and every error-queue drain) runs alone. After a timeout or link fault the session is broken
/// and refuses further use with <see cref="InstrumentLinkException"/>. Owns and disposes the link.
/// </summary>
public sealed partial class ScpiSession : IAsyncDisposable
{
    private readonly IMessageLink _link;
    private readonly TimeProvider _time;
    private readonly ILogger _logger;
    private readonly SemaphoreSlim _gate = new(1, 1);
    private readonly List<string> _group = [];
    private string? _brokenBecause;
    private int _owedReplies;

    /// <summary>Creates a session over <paramref name="link"/>.</summary>
    /// <param name="link">The open link; the session takes ownership.</param>
    /// <param name="options">Timeouts and error-queue cap; default <see cref="ScpiSessionOptions.Default"/>.</param>
    /// <param name="time">Clock for elapsed times; default system.</param>
    /// <param name="logger">Receives every exchange at Debug level.</param>
    public ScpiSession(
        IMessageLink link,
        ScpiSessionOptions? options = null,
        TimeProvider? time = null,
        ILogger? logger = null
    )
    {
        _link = link ?? throw new ArgumentNullException(nameof(link));
        Options = options ?? ScpiSessionOptions.Default;
        _time = time ?? TimeProvider.System;
        _logger = logger ?? NullLogger.Instance;
    }

    /// <summary>The session's options.</summary>
    public ScpiSessionOptions Options { get; }

    /// <summary>What the link is connected to.</summary>
    public string Endpoint => _link.Endpoint;

    /// <summary>True after a timeout or link fault; reconnect to go on.</summary>
    public bool IsBroken => _brokenBecause is not null || _link.IsBroken;

    /// <summary>Sends a command that has no reply.</summary>
    public async Task WriteAsync(string command, CancellationToken ct)
    {
        await _gate.WaitAsync(ct).ConfigureAwait(false);
        try
        {
            _ = await ExchangeLockedAsync(command, null, ct).ConfigureAwait(false);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>Sends a query and returns its reply line, waiting up to the session's query timeout.</summary>
    /// <exception cref="InstrumentTimeoutException">No reply in time (session then broken); carries the command and
    /// timeout.</exception>
    public Task<string> QueryAsync(string command, CancellationToken ct) =>
        QueryAsync(command, Options.QueryTimeout, ct);

    /// <summary>Sends a query and returns its reply line, waiting up to <paramref name="timeout"/>.</summary>
    public async Task<string> QueryAsync(string command, TimeSpan timeout, CancellationToken ct)
    {
        await _gate.WaitAsync(ct).ConfigureAwait(false);
        try
        {
            return (await ExchangeLockedAsync(command, timeout, ct).ConfigureAwait(false))!;
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>Sends a query whose reply is one number (NR1, NR2 or NR3).</summary>
    /// <exception cref="ScpiResponseException">The reply is not a number.</exception>
    public Task<ScpiNumber> QueryNumberAsync(string command, CancellationToken ct) =>
        QueryNumberAsync(command, Options.QueryTimeout, ct);

    /// <summary>Sends a query whose reply is one number, waiting up to <paramref name="timeout"/>.</summary>
    public async Task<ScpiNumber> QueryNumberAsync(string command, TimeSpan timeout, CancellationToken ct)
    {
        var reply = await QueryAsync(command, timeout, ct).ConfigureAwait(false);
        return ScpiNumber.TryParse(reply, out var number)
            ? number
            : throw new ScpiResponseException(command, reply, "a number (NR1, NR2 or NR3)");
    }

    /// <summary>Sends a query whose reply is a comma-separated list of numbers.</summary>
    public async Task<IReadOnlyList<ScpiNumber>> QueryNumbersAsync(
        string command,
        TimeSpan timeout,
        CancellationToken ct
    )
    {
        var reply = await QueryAsync(command, timeout, ct).ConfigureAwait(false);
        var fields = reply.Split(',');
        var numbers = new ScpiNumber[fields.Length];
        for (var i = 0; i < fields.Length; i++)
        {
            numbers[i] = ScpiNumber.TryParse(fields[i], out var n)
                ? n
                : throw new ScpiResponseException(
                    command,
                    reply,
                    $"a comma-separated list of numbers (item {i + 1} '{fields[i]}' is not one)"
                );
        }

        return numbers;
    }

    /// <summary>
    /// Reads the error queue until it reports 0 (at most <see cref="ScpiSessionOptions.MaxErrorQueueReads"/>
    /// reads) and throws if it held any error. Closes the current command group.
    /// </summary>
    /// <exception cref="ScpiInstrumentException">The queue held errors; the first is reported with the group's
    /// commands.</exception>
    public async Task CheckErrorsAsync(CancellationToken ct)
    {
        var (errors, group) = await DrainErrorsAsync(ct).ConfigureAwait(false);
        if (errors.Count > 0)
        {
            throw new ScpiInstrumentException(errors[0].Code, errors[0].Message, group, errors);
        }
    }

    /// <summary>Reads the error queue until it reports 0 and returns what it held, without throwing.</summary>
    /// <returns>The errors, oldest first, and the commands sent since the last check joined with "; ".</returns>
    public async Task<(IReadOnlyList<ScpiError> Errors, string Commands)> DrainErrorsAsync(CancellationToken ct)
    {
        await _gate.WaitAsync(ct).ConfigureAwait(false);
        try
        {
            var group = _group.Count == 0 ? "(no command)" : string.Join("; ", _group);
            var errors = new List<ScpiError>();
            for (var i = 0; i < Options.MaxErrorQueueReads; i++)
            {
                var query = Options.ErrorQueryCommand;
                var error = ScpiError.Parse(
                    (await ExchangeLockedAsync(query, Options.QueryTimeout, ct, track: false).ConfigureAwait(false))!,
                    query
                );
                if (error.Code == 0)
                {
                    break;
                }

                Log.InstrumentError(_logger, Endpoint, error.Code, error.Message, group);
                errors.Add(error);
            }

            _group.Clear();
            return (errors, group);
        }
        finally
        {
            _gate.Release();
        }
    }

    /// <summary>Disposes the link.</summary>
    public async ValueTask DisposeAsync()
    {
        await _link.DisposeAsync().ConfigureAwait(false);
        _gate.Dispose();
    }
}
