using System.Text.RegularExpressions;
using SortRig.Measurement.Specs;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace SortRig.Instruments.Profiles;

/// <summary>
/// Loads meter profiles (instruments/*.yaml) through YamlDotNet's representation model, so every
/// error can name its file, line, column and field. The format is in docs/instruments.md.
/// </summary>
public static partial class MeterProfileLoader
{
    private static readonly string[] s_keys =
    [
        "family",
        "identity",
        "comms",
        "wiring",
        "range_change_settle_s",
        "over_range",
        "ranges",
        "nplc",
        "commands",
    ];

    /// <summary>Loads one profile file.</summary>
    /// <exception cref="ProfileException">The file is not a valid profile.</exception>
    /// <exception cref="IOException">The file cannot be read.</exception>
    public static MeterProfile Load(string path) => Parse(ProfileLimits.Read(path), path);

    /// <summary>Loads every *.yaml and *.yml file in <paramref name="directory"/>, ordered by file name.</summary>
    /// <exception cref="ProfileException">A file is invalid, or two files declare the same family.</exception>
    public static IReadOnlyList<MeterProfile> LoadAll(string directory)
    {
        var files = Directory
            .EnumerateFiles(directory, "*.yaml")
            .Concat(Directory.EnumerateFiles(directory, "*.yml"))
            .Order(StringComparer.Ordinal);
        var profiles = new List<MeterProfile>();
        foreach (var file in files)
        {
            var profile = Load(file);
            if (profiles.Find(p => p.Family == profile.Family) is { } first)
            {
                throw new ProfileException(
                    file,
                    0,
                    0,
                    "family",
                    $"'{profile.Family}' is already declared by {first.SourcePath}",
                    "a family name used by one file only"
                );
            }

            profiles.Add(profile);
        }

        return profiles;
    }

    /// <summary>Parses profile text; <paramref name="file"/> names it in errors.</summary>
    /// <exception cref="ProfileException">The text is not a valid profile.</exception>
    public static MeterProfile Parse(string yaml, string file)
    {
        ProfileLimits.Check(yaml, file);
        var stream = new YamlStream();
        var parser = new Parser(new StringReader(yaml));
        try
        {
            stream.Load(parser);
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
            // YamlDotNet can fail this way on some malformed input (an unclosed '[' throws
            // InvalidOperationException; two aliases in a row, "a: *x *y", ArgumentException);
            // the last event it parsed tells where.
            var at = parser.Current?.End ?? Mark.Empty;
            throw new ProfileException(
                file,
                (int)at.Line,
                (int)at.Column,
                string.Empty,
                "YAML error: malformed text near this point (unclosed bracket or quote, or a misplaced alias?)",
                "well-formed YAML",
                ex
            );
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
                "lower-case letters, digits and '-', e.g. bench-6half-lan"
            );
        }

        var model = ReadModelPattern(root.Required("identity", "a mapping with the model pattern").AsMap("model"));
        var comms = CommsSectionReader.Read(root.Required("comms", "a mapping with transports and terminator"));
        var wiring = root.Required("wiring", "a mapping with two_wire and four_wire").AsMap("two_wire", "four_wire");
        var twoWire = wiring.Required("two_wire", "true or false").AsBool();
        var fourWireField = wiring.Required("four_wire", "true or false");
        var fourWire = fourWireField.AsBool();
        if (!twoWire && !fourWire)
        {
            throw fourWireField.Error("and two_wire are both false", "at least one wiring supported");
        }

        var settle = root.Required("range_change_settle_s", "seconds to wait after a range change")
            .AsDouble(0, 60, " s");
        var overRange = root.Required("over_range", "the over-range factor, e.g. 1.2").AsDouble(1.0, 2.0, "");
        var ranges = SpecSectionReader.ReadRanges(root.Required("ranges", "a list of ranges"), overRange);
        var nplcs = SpecSectionReader.ReadNplcs(root.Required("nplc", "a list of NPLC settings"));
        var commands = CommandSectionReader.Read(
            root.Required("commands", "a mapping of command templates"),
            twoWire,
            fourWire,
            nplcs.Count
        );
        var spec = new MeterSpec(family, ranges, nplcs, fourWire, TimeSpan.FromSeconds(settle));
        return new MeterProfile(family, file, model, comms, twoWire, spec, commands);
    }

    private static Regex ReadModelPattern(YamlMap identity)
    {
        var field = identity.Required("model", "a regular expression for the *IDN? model field");
        try
        {
            return new Regex(field.AsString(), RegexOptions.CultureInvariant, TimeSpan.FromSeconds(1));
        }
        catch (ArgumentException ex)
        {
            throw field.Error($"is not a valid regular expression ({ex.Message})", "a .NET regular expression");
        }
    }

    [GeneratedRegex("^[a-z0-9][a-z0-9-]*$", RegexOptions.CultureInvariant)]
    private static partial Regex FamilyPattern();
}
