using System.Text.RegularExpressions;
using SortRig.Instruments.Profiles;
using SortRig.Measurement.Specs;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace SortRig.Instruments.Typed;

/// <summary>
/// Loads a typed-meter profile (instruments/typed/*.yaml): a meter with no computer link, read by eye. Errors are
/// <see cref="ProfileException"/>s with file, line and column, as for the SCPI profiles. Format in docs/instruments.md,
/// "Typed readings".
/// </summary>
public static partial class TypedProfileLoader
{
    private static readonly string[] s_keys = ["family", "counts", "ranges"];
    private static readonly string[] s_rangeKeys = ["full_scale", "reading_pct", "digits"];

    /// <summary>Loads and validates the profile at <paramref name="path"/>.</summary>
    /// <exception cref="ProfileException">The file is not a valid typed-meter profile.</exception>
    public static DisplayMeterSpec Load(string path) => Parse(ProfileLimits.Read(path), path);

    /// <summary>Parses profile text; <paramref name="file"/> names it in errors.</summary>
    /// <exception cref="ProfileException">The text is not a valid typed-meter profile.</exception>
    public static DisplayMeterSpec Parse(string yaml, string file)
    {
        ProfileLimits.Check(yaml, file);
        var stream = new YamlStream();
        try
        {
            stream.Load(new StringReader(yaml));
        }
        catch (YamlException ex)
        {
            throw new ProfileException(
                file,
                (int)ex.Start.Line,
                (int)ex.Start.Column,
                string.Empty,
                $"YAML error: {ex.Message}",
                "well-formed YAML",
                ex
            );
        }
        catch (Exception ex) when (ex is InvalidOperationException or ArgumentException)
        {
            throw new ProfileException(file, 0, 0, string.Empty, "YAML error: malformed text", "well-formed YAML", ex);
        }

        if (stream.Documents.Count != 1)
        {
            throw new ProfileException(
                file,
                1,
                1,
                string.Empty,
                $"has {stream.Documents.Count} YAML documents",
                "exactly one"
            );
        }

        var root = new YamlField(stream.Documents[0].RootNode, file, string.Empty).AsMap(s_keys);
        var familyField = root.Required("family", "a family name of lower-case letters, digits and '-'");
        var family = familyField.AsString();
        if (!FamilyPattern().IsMatch(family))
        {
            throw familyField.Error(
                $"'{family}' is not a family name",
                "lower-case letters, digits and '-', e.g. handheld-typed"
            );
        }

        var counts = root.Required("counts", "the display counts, e.g. 50000").AsInt(100, 10_000_000, " counts");
        var ranges = new List<DisplayRange>();
        foreach (var item in root.Required("ranges", "a list of ranges").AsList(1))
        {
            var map = item.AsMap(s_rangeKeys);
            var fullScaleField = map.Required("full_scale", "the range in ohms");
            var fullScale = fullScaleField.AsDouble(1e-3, 1e12, " ohm");
            if (ranges.Count > 0 && fullScale <= ranges[^1].FullScale)
            {
                throw fullScaleField.Error("is not above the range before it", "ranges in ascending full_scale");
            }

            ranges.Add(
                new DisplayRange(
                    fullScale,
                    counts,
                    map.Required("reading_pct", "the % of reading accuracy term").AsDouble(0, 10, " %"),
                    map.Required("digits", "the digits accuracy term").AsDouble(0, 1000, " digits")
                )
            );
        }

        return new DisplayMeterSpec(family, ranges);
    }

    [GeneratedRegex("^[a-z0-9]+(?:-[a-z0-9]+)*$", RegexOptions.CultureInvariant)]
    private static partial Regex FamilyPattern();
}
