using System.Globalization;
using System.Text;

namespace SortRig.Instruments.Scpi;

/// <summary>
/// How text that came from a meter (an *IDN? reply, an error-queue message, a garbled reading) is shown to
/// people: control characters, which a terminal would obey (escape sequences that set the title or clear
/// the screen), are written as <c>\xNN</c>; everything else is kept.
/// </summary>
public static class ReplyText
{
    /// <summary>The text with every control character shown as \xNN.</summary>
    public static string Printable(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (!text.Any(char.IsControl))
        {
            return text;
        }

        var sb = new StringBuilder(text.Length + 16);
        foreach (var c in text)
        {
            if (char.IsControl(c))
            {
                sb.Append(CultureInfo.InvariantCulture, $"\\x{(int)c:X2}");
            }
            else
            {
                sb.Append(c);
            }
        }

        return sb.ToString();
    }
}
