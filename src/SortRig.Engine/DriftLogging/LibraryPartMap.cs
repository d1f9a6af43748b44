using SortRig.Engine.Parts;

namespace SortRig.Engine.DriftLogging;

/// <summary>
/// Parses which library part sits on which scanner channel: "101=17,102=#18,103-104=20-21" (our own notation).
/// Each item is channel=part; the channel side is read by <see cref="ChannelListParser"/>, the part side by the
/// library's <see cref="PartIds"/> (an id, a range low-high, or the "#17" of a printed part label), and a range
/// of channels takes a range of parts of the same length in order.
/// </summary>
public static class LibraryPartMap
{
    /// <summary>The option as named in errors: the configuration key and the command-line flag.</summary>
    public const string Option = "Drift.LibraryParts (--library-parts)";

    /// <summary>The configuration key, the ParamName of the errors.</summary>
    public const string Key = "Drift.LibraryParts";

    /// <summary>Parses the mapping and checks it against the scan list; empty or blank text maps nothing.</summary>
    /// <param name="text">Comma-separated items channel=part.</param>
    /// <param name="channels">The part channels being scanned.</param>
    /// <returns>Library part id by scanner channel.</returns>
    /// <exception cref="ArgumentException">A malformed item, a channel not in the scan list or given twice, or a part
    /// on two channels; the message names <see cref="Option"/> and the item.</exception>
    public static IReadOnlyDictionary<int, long> Parse(string? text, IReadOnlyList<int> channels)
    {
        ArgumentNullException.ThrowIfNull(channels);
        var map = new Dictionary<int, long>();
        if (string.IsNullOrWhiteSpace(text))
        {
            return map;
        }

        var channelOf = new Dictionary<long, int>();
        foreach (var item in text.Split(',', StringSplitOptions.TrimEntries))
        {
            var sides = item.Split('=', StringSplitOptions.TrimEntries);
            if (sides.Length != 2 || sides[0].Length == 0 || sides[1].Length == 0)
            {
                throw Bad(item, "must be channel=part, e.g. 101=17, 102=#18 or 103-104=20-21");
            }

            var onChannels = Channels(sides[0], item);
            var parts = Parts(sides[1], item);
            if (onChannels.Count != parts.Count)
            {
                throw Bad(item, $"names {onChannels.Count} channel(s) but {parts.Count} part(s)");
            }

            for (var i = 0; i < parts.Count; i++)
            {
                var (channel, part) = (onChannels[i], parts[i]);
                if (!channels.Contains(channel))
                {
                    throw Bad(item, $"channel {channel} is not in the scan list ({string.Join(",", channels)})");
                }

                if (map.TryGetValue(channel, out var already))
                {
                    throw Bad(item, $"channel {channel} already has part {already}");
                }

                if (channelOf.TryGetValue(part, out var other))
                {
                    throw Bad(item, $"part {part} is already on channel {other}; a part can be on one channel only");
                }

                map[channel] = part;
                channelOf[part] = channel;
            }
        }

        return map;
    }

    private static IReadOnlyList<int> Channels(string side, string item)
    {
        try
        {
            return ChannelListParser.Parse(side, Option);
        }
        catch (ArgumentException e)
        {
            throw Bad(item, $"'{side}' is not a channel or a range of channels such as 103-104 ({Tail(e.Message)})");
        }
    }

    // A printed label names the part "#17": the '#' before each end is dropped, the rest is the library's id parser.
    private static IReadOnlyList<long> Parts(string side, string item)
    {
        try
        {
            return PartIds.Parse(side.TrimStart('#').Replace("-#", "-", StringComparison.Ordinal), Option);
        }
        catch (ArgumentException e)
        {
            throw Bad(item, Tail(e.Message));
        }
    }

    private static string Tail(string message) =>
        message.StartsWith(Option, StringComparison.Ordinal) ? message[Option.Length..].TrimStart(':', ' ') : message;

    /// <summary>The error for one item; its ParamName is the configuration key.</summary>
    internal static ArgumentException Bad(string item, string why, string key = Key) =>
        new($"{Option}: item '{item}': {why}.", key);
}
