using System.CommandLine;
using System.Globalization;

namespace SortRig.Host.Cli;

/// <summary>
/// Maps command-line options onto configuration keys so a flag, an environment variable and
/// appsettings.json all set the same option (flags win).
/// </summary>
internal sealed class FlagMap
{
    private readonly List<(Option Option, string Key)> _entries = [];

    public Option<T> Add<T>(Command command, Option<T> option, string key)
    {
        command.Add(option);
        _entries.Add((option, key));
        return option;
    }

    /// <summary>The flag that sets a configuration key ("--match" for "Sort:MatchTolerance"), or null.</summary>
    public string? FlagFor(string key) =>
        _entries.FirstOrDefault(e => string.Equals(e.Key, key, StringComparison.OrdinalIgnoreCase)).Option?.Name;

    /// <summary>Configuration overrides for the flags actually given.</summary>
    public Dictionary<string, string?> Overrides(ParseResult result)
    {
        var overrides = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase);
        foreach (var (option, key) in _entries)
        {
            var given = result.GetResult(option);
            if (given is null || given.Implicit)
            {
                continue;
            }

            var value = given.GetValueOrDefault<object?>();
            overrides[key] = value switch
            {
                null => null,
                IFormattable f => f.ToString(null, CultureInfo.InvariantCulture),
                _ => value.ToString(),
            };
        }

        return overrides;
    }
}
