using System.Globalization;

namespace SortRig.Engine.Checking;

/// <summary>The session's check standard.</summary>
/// <param name="Kind">Where it comes from.</param>
/// <param name="Nominal">Its marked value, ohms.</param>
/// <param name="LibraryPartId">The library part's id (kind Library), else null.</param>
/// <param name="CalibratedOhms">Its calibrated value, ohms, when known (for the meter's apparent gain).</param>
public sealed record CheckSource(CheckSourceKind Kind, double Nominal, long? LibraryPartId, double? CalibratedOhms)
{
    /// <summary>The name its readings are kept under in the log ("fixture:10000", "library:41").</summary>
    public string Name =>
        Kind == CheckSourceKind.Library
            ? string.Create(CultureInfo.InvariantCulture, $"library:{LibraryPartId}")
            : string.Create(CultureInfo.InvariantCulture, $"fixture:{Nominal:G9}");

    /// <summary>
    /// Reads the --check text: "fixture:&lt;ohms&gt;" (or just "&lt;ohms&gt;") for a reference part at the fixture,
    /// "library:&lt;part id&gt;" for a library part. Throws <see cref="FormatException"/> saying what is wrong.
    /// </summary>
    /// <param name="text">The option's text.</param>
    /// <param name="calibratedOhms">The --check-value, ohms; 0 when not given.</param>
    public static CheckSource Parse(string text, double calibratedOhms)
    {
        ArgumentNullException.ThrowIfNull(text);
        var colon = text.IndexOf(':', StringComparison.Ordinal);
        var kind = colon < 0 ? "fixture" : text[..colon].Trim().ToLowerInvariant();
        var rest = colon < 0 ? text.Trim() : text[(colon + 1)..].Trim();
        double? calibrated = calibratedOhms > 0 ? calibratedOhms : null;
        if (calibratedOhms < 0 || !double.IsFinite(calibratedOhms))
        {
            throw new FormatException($"the check's calibrated value must be > 0 ohm; got {calibratedOhms}");
        }

        switch (kind)
        {
            case "fixture":
                if (
                    !double.TryParse(rest, NumberStyles.Float, CultureInfo.InvariantCulture, out var nominal)
                    || !double.IsFinite(nominal)
                    || nominal is < 1e-3 or > 1e9
                )
                {
                    throw new FormatException($"'{text}' is not fixture:<ohms> with ohms in [0.001, 1e9]");
                }

                return new CheckSource(CheckSourceKind.Fixture, nominal, null, calibrated);
            case "library":
                if (!long.TryParse(rest, NumberStyles.None, CultureInfo.InvariantCulture, out var id) || id <= 0)
                {
                    throw new FormatException($"'{text}' is not library:<part id> with a positive id");
                }

                return new CheckSource(CheckSourceKind.Library, 0, id, calibrated);
            default:
                throw new FormatException($"'{text}' names no check: use fixture:<ohms> or library:<part id>");
        }
    }
}
