using System.Globalization;

namespace SortRig.Engine.Parts;

/// <summary>Parses part id lists given on the command line: "3,4,9" or ranges "12-15", mixed, in order, repeats
/// dropped.</summary>
internal static class PartIds
{
    /// <summary>Longest range accepted in one token.</summary>
    public const int MaxRange = 100_000;

    /// <exception cref="ArgumentException">A token is not an id &gt; 0 or a range low-high with low &lt;=
    /// high.</exception>
    public static IReadOnlyList<long> Parse(string? text, string option = "--ids")
    {
        var ids = new List<long>();
        var seen = new HashSet<long>();
        foreach (var raw in (text ?? "").Split([',', ' '], StringSplitOptions.RemoveEmptyEntries))
        {
            var dash = raw.IndexOf('-', 1);
            long low,
                high;
            if (dash < 0)
            {
                low = high = Id(raw, raw, option);
            }
            else
            {
                low = Id(raw[..dash], raw, option);
                high = Id(raw[(dash + 1)..], raw, option);
                if (high < low || high - low >= MaxRange)
                {
                    throw new ArgumentException(
                        $"{option}: '{raw}' must be a range low-high with low <= high and at most {MaxRange} ids"
                    );
                }
            }

            for (var id = low; id <= high; id++)
            {
                if (seen.Add(id))
                {
                    ids.Add(id);
                }
            }
        }

        return ids.Count > 0 ? ids : throw new ArgumentException($"{option}: expected part ids such as 3,4,9 or 12-15");
    }

    private static long Id(string text, string token, string option) =>
        long.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out var id) && id > 0
            ? id
            : throw new ArgumentException(
                $"{option}: '{token}' is not a part id (a whole number > 0) or a range such as 12-15"
            );
}
