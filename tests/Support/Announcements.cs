using System.Text.RegularExpressions;

namespace SortRig.Tests.Support;

/// <summary>One plain announcement line as the operator heard it.</summary>
internal sealed record Heard(int Part, string Cup, bool Repeated);

/// <summary>Reads the plain announcement lines (PlainTextAnnouncer's format): cups and notes.</summary>
internal static partial class Announcements
{
    /// <summary>Every "part N: cup X" line, in order.</summary>
    public static List<Heard> Cups(string text) =>
        CupLine()
            .Matches(text)
            .Select(m => new Heard(int.Parse(m.Groups[1].Value), m.Groups[2].Value, m.Groups[3].Success))
            .ToList();

    /// <summary>Every "note: ..." line's text, in order.</summary>
    public static List<string> Notes(string text) =>
        NoteLine().Matches(text).Select(m => m.Groups[1].Value.TrimEnd('\r')).ToList();

    [GeneratedRegex(@"^part (\d+): cup (\S+)( \(repeated\))?", RegexOptions.Multiline)]
    private static partial Regex CupLine();

    [GeneratedRegex(@"^note: (.*)$", RegexOptions.Multiline)]
    private static partial Regex NoteLine();
}
