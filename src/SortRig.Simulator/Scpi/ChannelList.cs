using System.Globalization;
using System.Text.RegularExpressions;
using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Scpi;

/// <summary>SCPI channel lists: "(@101)", "(@101,103:105)", "(@)" (SCPI-99 vol. 1 sec. 8.3.2).</summary>
internal static partial class ChannelList
{
    public const int MaxEntries = 200;

    public static IReadOnlyList<int> Parse(string text)
    {
        var match = Shape().Match(text);
        if (!match.Success)
        {
            throw new ScpiException(text.StartsWith('(') ? ScpiError.Syntax : ScpiError.DataType);
        }

        var body = match.Groups[1].Value.Trim();
        var channels = new List<int>();
        foreach (var item in body.Length == 0 ? [] : body.Split(','))
        {
            var ends = item.Split(':');
            var first = int.Parse(ends[0], CultureInfo.InvariantCulture);
            var last = ends.Length == 2 ? int.Parse(ends[1], CultureInfo.InvariantCulture) : first;
            if (last < first || channels.Count + (last - first + 1) > MaxEntries)
            {
                throw new ScpiException(ScpiError.DataOutOfRange);
            }

            channels.AddRange(Enumerable.Range(first, last - first + 1));
        }

        return channels;
    }

    public static string Format(IEnumerable<int> channels) =>
        "(@" + string.Join(',', channels.Select(c => c.ToString(CultureInfo.InvariantCulture))) + ")";

    [GeneratedRegex(@"^\(@\s*((?:\d{1,4}(?::\d{1,4})?\s*(?:,\s*\d{1,4}(?::\d{1,4})?\s*)*)?)\)$")]
    private static partial Regex Shape();
}
