using System.Globalization;
using System.Text.RegularExpressions;

namespace SortRig.Instruments.Profiles;

/// <summary>
/// A SCPI command with {placeholders}, e.g. "SENS:{function}:RANG {range}". Placeholders are
/// lower-case names in braces; the loader checks each template uses only the ones it may.
/// </summary>
public sealed partial record CommandTemplate(string Text)
{
    /// <summary>The placeholder names in the text, in order of appearance, without braces.</summary>
    public IReadOnlyList<string> Placeholders =>
        [.. PlaceholderPattern().Matches(Text).Select(m => m.Groups[1].Value).Distinct()];

    /// <summary>True when the template is a query (contains '?').</summary>
    public bool IsQuery => Text.Contains('?', StringComparison.Ordinal);

    /// <summary>Fills the placeholders; numbers are written in invariant round-trip form (e.g. 10000, 0.02).</summary>
    /// <exception cref="ArgumentException">A placeholder in the text has no value.</exception>
    public string Render(params (string Name, object Value)[] values) =>
        PlaceholderPattern()
            .Replace(Text, m =>
            {
                foreach (var (name, value) in values)
                {
                    if (name == m.Groups[1].Value)
                    {
                        return value is double d
                            ? d.ToString("R", CultureInfo.InvariantCulture)
                            : Convert.ToString(value, CultureInfo.InvariantCulture) ?? string.Empty;
                    }
                }

                throw new ArgumentException(
                    $"no value for placeholder {{{m.Groups[1].Value}}} in '{Text}'",
                    nameof(values)
                );
            });

    /// <inheritdoc/>
    public override string ToString() => Text;

    [GeneratedRegex(@"\{([a-z_]+)\}", RegexOptions.CultureInvariant)]
    private static partial Regex PlaceholderPattern();
}
