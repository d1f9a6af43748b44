namespace SortRig.Host.VerbSupport;

/// <summary>
/// Names and notes typed by people (session names, locations, who takes a part, reasons) end up in logs,
/// reports, CSV files and on the terminal: a control character there could forge a log line or drive the
/// terminal, so such text is refused at entry.
/// </summary>
internal static class TextArg
{
    /// <summary>The problem with <paramref name="value"/> as the value of <paramref name="option"/>, or null when it is
    /// fine.</summary>
    public static string? Problem(string? value, string option) =>
        value is not null && value.FirstOrDefault(char.IsControl) is var c && c != default
            ? $"{option}: control characters are not allowed (found U+{(int)c:X4}); use plain text"
            : null;

    /// <summary>Throws <see cref="VerbException"/> when <paramref name="value"/> holds a control character.</summary>
    public static void Check(string? value, string option)
    {
        if (Problem(value, option) is { } problem)
        {
            throw new VerbException(problem);
        }
    }
}
