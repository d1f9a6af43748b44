namespace SortRig.Instruments.Scpi;

/// <summary>Timing and error-queue options of a <see cref="ScpiSession"/>. Validated at construction.</summary>
public sealed class ScpiSessionOptions
{
    /// <summary>The defaults: 5 s query timeout, 32 error-queue reads, SYST:ERR?.</summary>
    public static ScpiSessionOptions Default { get; } = new();

    /// <summary>Creates validated options.</summary>
    /// <param name="queryTimeout">Time allowed for a reply; 0.01-600 s, default 5 s.</param>
    /// <param name="maxErrorQueueReads">Cap on SYST:ERR? reads per check; 1-1000, default 32.</param>
    /// <param name="errorQueryCommand">The error queue query; default "SYST:ERR?".</param>
    /// <exception cref="ArgumentOutOfRangeException">A value is outside its valid range.</exception>
    public ScpiSessionOptions(
        TimeSpan? queryTimeout = null,
        int maxErrorQueueReads = 32,
        string errorQueryCommand = "SYST:ERR?"
    )
    {
        QueryTimeout = queryTimeout ?? TimeSpan.FromSeconds(5);
        if (QueryTimeout < TimeSpan.FromMilliseconds(10) || QueryTimeout > TimeSpan.FromSeconds(600))
        {
            throw new ArgumentOutOfRangeException(
                nameof(queryTimeout),
                QueryTimeout,
                "queryTimeout must be 0.01 to 600 s"
            );
        }

        MaxErrorQueueReads = maxErrorQueueReads is >= 1 and <= 1000
            ? maxErrorQueueReads
            : throw new ArgumentOutOfRangeException(
                nameof(maxErrorQueueReads),
                maxErrorQueueReads,
                "maxErrorQueueReads must be 1 to 1000"
            );
        ErrorQueryCommand =
            !string.IsNullOrWhiteSpace(errorQueryCommand) && errorQueryCommand.EndsWith('?')
                ? errorQueryCommand
                : throw new ArgumentOutOfRangeException(
                    nameof(errorQueryCommand),
                    errorQueryCommand,
                    "errorQueryCommand must be a query ending in '?'"
                );
    }

    /// <summary>Time allowed for a reply.</summary>
    public TimeSpan QueryTimeout { get; }

    /// <summary>Cap on SYST:ERR? reads per check, so a babbling instrument cannot loop us for ever.</summary>
    public int MaxErrorQueueReads { get; }

    /// <summary>The error queue query.</summary>
    public string ErrorQueryCommand { get; }
}
