using System.Globalization;

namespace SortRig.Engine.DriftLogging;

/// <summary>Parses scanner channel lists such as "101-104,107" (our own notation, close to SCPI's
/// (@101:104,107)).</summary>
public static class ChannelListParser
{
    /// <summary>Most channels in one list.</summary>
    public const int MaxChannels = 64;

    /// <summary>Parses the list into distinct channels in the order given; ranges ascend or descend.</summary>
    /// <param name="text">Comma-separated channels and ranges "a-b", channels 1..9999.</param>
    /// <param name="option">Option name for error messages.</param>
    /// <exception cref="ArgumentException">Empty list, bad item, channel out of range, duplicate or more than 64
    /// channels.</exception>
    public static IReadOnlyList<int> Parse(string? text, string option)
    {
        if (string.IsNullOrWhiteSpace(text))
        {
            throw new ArgumentException(
                $"{option} must list scanner channels such as '101-104,107'; was empty.",
                option
            );
        }

        var channels = new List<int>();
        foreach (var raw in text.Split(',', StringSplitOptions.TrimEntries))
        {
            var parts = raw.Split('-', StringSplitOptions.TrimEntries);
            if (parts.Length is < 1 or > 2 || parts.Any(p => p.Length == 0))
            {
                throw new ArgumentException(
                    $"{option}: item '{raw}' of '{text}' must be a channel (101) or a range (101-104).",
                    option
                );
            }

            var from = Channel(parts[0], raw, text, option);
            var to = parts.Length == 2 ? Channel(parts[1], raw, text, option) : from;
            var step = to >= from ? 1 : -1;
            for (var c = from; ; c += step)
            {
                if (channels.Contains(c))
                {
                    throw new ArgumentException($"{option}: channel {c} appears twice in '{text}'.", option);
                }

                channels.Add(c);
                if (channels.Count > MaxChannels)
                {
                    throw new ArgumentException($"{option}: '{text}' lists more than {MaxChannels} channels.", option);
                }

                if (c == to)
                {
                    break;
                }
            }
        }

        return channels;
    }

    private static int Channel(string token, string item, string text, string option) =>
        int.TryParse(token, NumberStyles.None, CultureInfo.InvariantCulture, out var c) && c is >= 1 and <= 9999
            ? c
            : throw new ArgumentException(
                $"{option}: '{token}' in item '{item}' of '{text}' is not a channel number 1..9999.",
                option
            );
}
