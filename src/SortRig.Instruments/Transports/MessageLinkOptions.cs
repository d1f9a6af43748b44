namespace SortRig.Instruments.Transports;

/// <summary>Framing and timing options shared by every message link. Validated at construction.</summary>
public sealed class MessageLinkOptions
{
    /// <summary>The defaults: "\n" terminator, 5 s connect and write timeouts, 64 KiB lines.</summary>
    public static MessageLinkOptions Default { get; } = new();

    /// <summary>Creates validated options.</summary>
    /// <param name="terminator">Line terminator, 1-2 characters; default "\n". With "\n" a trailing "\r" is also
    /// removed from replies.</param>
    /// <param name="connectTimeout">Time allowed to open the connection; 0.01-300 s, default 5 s.</param>
    /// <param name="writeTimeout">Time allowed for one write to complete; 0.01-300 s, default 5 s.</param>
    /// <param name="maxLineLength">Longest reply line accepted, in bytes; 16 B-16 MiB, default 65 536.</param>
    /// <exception cref="ArgumentOutOfRangeException">A value is outside its valid range.</exception>
    public MessageLinkOptions(
        string terminator = "\n",
        TimeSpan? connectTimeout = null,
        TimeSpan? writeTimeout = null,
        int maxLineLength = 65_536
    )
    {
        if (string.IsNullOrEmpty(terminator) || terminator.Length > 2)
        {
            throw new ArgumentOutOfRangeException(
                nameof(terminator),
                terminator,
                "terminator must be 1 or 2 characters, e.g. \"\\n\" or \"\\r\\n\""
            );
        }

        Terminator = terminator;
        ConnectTimeout = CheckTime(connectTimeout ?? TimeSpan.FromSeconds(5), nameof(connectTimeout));
        WriteTimeout = CheckTime(writeTimeout ?? TimeSpan.FromSeconds(5), nameof(writeTimeout));
        if (maxLineLength is < 16 or > 16 * 1024 * 1024)
        {
            throw new ArgumentOutOfRangeException(
                nameof(maxLineLength),
                maxLineLength,
                "maxLineLength must be 16 to 16 777 216 bytes"
            );
        }

        MaxLineLength = maxLineLength;
    }

    /// <summary>Line terminator appended to writes and searched for in replies.</summary>
    public string Terminator { get; }

    /// <summary>Time allowed to open the connection.</summary>
    public TimeSpan ConnectTimeout { get; }

    /// <summary>Time allowed for one write; on expiry the link is broken.</summary>
    public TimeSpan WriteTimeout { get; }

    /// <summary>Longest reply line accepted, in bytes; a longer one breaks the link.</summary>
    public int MaxLineLength { get; }

    /// <summary>A copy with another terminator.</summary>
    public MessageLinkOptions WithTerminator(string terminator) =>
        new(terminator, ConnectTimeout, WriteTimeout, MaxLineLength);

    private static TimeSpan CheckTime(TimeSpan value, string name) =>
        value >= TimeSpan.FromMilliseconds(10) && value <= TimeSpan.FromSeconds(300)
            ? value
            : throw new ArgumentOutOfRangeException(name, value, $"{name} must be 0.01 to 300 s");
}
