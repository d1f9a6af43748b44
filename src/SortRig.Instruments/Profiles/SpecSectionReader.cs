using SortRig.Measurement.Specs;

namespace SortRig.Instruments.Profiles;

/// <summary>Reads the "ranges" and "nplc" lists of a profile, checking values and order.</summary>
internal static class SpecSectionReader
{
    private static readonly string[] s_rangeKeys =
    [
        "full_scale",
        "over_range",
        "accuracy_24h",
        "accuracy_1y",
        "test_current_a",
    ];
    private static readonly string[] s_accuracyKeys = ["reading_pct", "range_pct"];
    private static readonly string[] s_nplcKeys = ["nplc", "digits", "resolution_ppm", "readings_per_s", "noise_ppm"];

    public static IReadOnlyList<RangeSpec> ReadRanges(YamlField list, double defaultOverRange)
    {
        var ranges = new List<RangeSpec>();
        foreach (var item in list.AsList(minCount: 1))
        {
            var map = item.AsMap(s_rangeKeys);
            var fullScaleField = map.Required("full_scale", "the range full scale in ohms");
            var fullScale = fullScaleField.AsDouble(1e-3, 1e12, " ohm");
            if (ranges.Count > 0 && fullScale <= ranges[^1].FullScale)
            {
                throw fullScaleField.Error(
                    $"{fullScale} ohm does not follow {ranges[^1].FullScale} ohm",
                    "ranges in ascending order of full_scale, each once"
                );
            }

            var overRange = map.Optional("over_range")?.AsDouble(1.0, 2.0, "") ?? defaultOverRange;
            var day = ReadAccuracy(
                map.Required("accuracy_24h", "reading_pct and range_pct within 24 h of calibration")
            );
            var yearField = map.Required("accuracy_1y", "reading_pct and range_pct within one year of calibration");
            var year = ReadAccuracy(yearField);
            if (day.PercentOfReading > year.PercentOfReading || day.PercentOfRange > year.PercentOfRange)
            {
                throw yearField.Error(
                    "is tighter than accuracy_24h",
                    "each 1-year term at least as large as the 24 h term"
                );
            }

            var current = map.Required("test_current_a", "the source current in amperes (0 when unknown)")
                .AsDouble(0, 1, " A");
            ranges.Add(new RangeSpec(fullScale, overRange, day, year, current));
        }

        return ranges;
    }

    public static IReadOnlyList<NplcSpec> ReadNplcs(YamlField list)
    {
        var settings = new List<NplcSpec>();
        foreach (var item in list.AsList(minCount: 1))
        {
            var map = item.AsMap(s_nplcKeys);
            var nplcField = map.Required("nplc", "the integration time in power-line cycles");
            var nplc = nplcField.AsDouble(1e-4, 1000, " PLC");
            if (settings.Count > 0 && nplc <= settings[^1].Nplc)
            {
                throw nplcField.Error(
                    $"{nplc} does not follow {settings[^1].Nplc}",
                    "NPLC settings in ascending order, each once"
                );
            }

            settings.Add(
                new NplcSpec(
                    nplc,
                    map.Required("digits", "displayed digits, e.g. 6.5").AsDouble(2.5, 9.5, " digits"),
                    map.Required("resolution_ppm", "the resolution in ppm of range").AsDouble(1e-4, 1e5, " ppm"),
                    map.Required("readings_per_s", "readings per second with autozero on").AsDouble(1e-3, 1e6, "/s"),
                    map.Required("noise_ppm", "rms noise in ppm of range (0 when unknown)").AsDouble(0, 1e5, " ppm")
                )
            );
        }

        return settings;
    }

    private static AccuracySpec ReadAccuracy(YamlField field)
    {
        var map = field.AsMap(s_accuracyKeys);
        return new AccuracySpec(
            map.Required("reading_pct", "the gain term in % of reading").AsDouble(0, 10, " %"),
            map.Required("range_pct", "the offset term in % of range").AsDouble(0, 10, " %")
        );
    }
}
