namespace SortRig.Host.Hosting;

/// <summary>
/// The command that carries on a stopped session: the command line as given, with the session named
/// when it was not (a session resumes by name). Shown after Ctrl+C.
/// </summary>
internal static class ResumeHint
{
    /// <summary>Exit code after Ctrl+C or SIGTERM: 128 + SIGINT, as shells report an interrupted program.</summary>
    public const int Interrupted = 130;

    /// <param name="args">The verb and flags as given (without the program).</param>
    /// <param name="session">The session's name.</param>
    public static string Command(IReadOnlyList<string> args, string session)
    {
        var words = new List<string>(args);
        if (!words.Contains("--session", StringComparer.Ordinal))
        {
            words.Add("--session");
            words.Add(session);
        }

        return "sortrig " + string.Join(' ', words.Select(Quote));
    }

    private static string Quote(string word) =>
        word.Length > 0
        && word.All(c => char.IsAsciiLetterOrDigit(c) || "-_.:/=@%+,".Contains(c, StringComparison.Ordinal))
            ? word
            : "'" + word.Replace("'", "'\\''", StringComparison.Ordinal) + "'";
}
