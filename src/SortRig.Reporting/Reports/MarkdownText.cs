using System.Globalization;
using System.Text;

namespace SortRig.Reporting.Reports;

/// <summary>
/// Text typed by people or sent by a meter (session and channel names, cup labels), made safe to put in
/// a markdown report: characters that start links, code, headings, table cells and HTML are backslash-escaped
/// (CommonMark sec. 2.4: any ASCII punctuation may be escaped), control characters (a newline that would
/// start a forged heading, escape sequences) are shown as <c>\xNN</c>.
/// </summary>
public static class MarkdownText
{
    // Links, images, code, headings, table cells, HTML and emphasis markers; "_" inside names (R-2R_MSB) stays
    // readable.
    private const string Special = "\\`*[]#|<>!";

    /// <summary>The text with markdown punctuation escaped and control characters shown as \xNN.</summary>
    public static string Escape(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var sb = new StringBuilder(text.Length + 8);
        foreach (var c in text)
        {
            if (char.IsControl(c))
            {
                sb.Append(CultureInfo.InvariantCulture, $"\\x{(int)c:X2}");
            }
            else
            {
                if (Special.Contains(c, StringComparison.Ordinal))
                {
                    sb.Append('\\');
                }

                sb.Append(c);
            }
        }

        return sb.ToString();
    }
}
