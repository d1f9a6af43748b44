namespace SortRig.Reporting.Reports;

/// <summary>Validates a <see cref="ReportInput"/>, naming the list, index and field of the first bad value.</summary>
internal static class ReportInputCheck
{
    public static void Validate(ReportInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        for (int i = 0; i < input.Parts.Count; i++)
        {
            ReportPart p = input.Parts[i];
            Require(
                double.IsFinite(p.NominalOhms) && p.NominalOhms > 0,
                $"Parts[{i}] (part {p.Number}).NominalOhms",
                "finite and > 0 ohm",
                p.NominalOhms
            );
            Require(
                double.IsFinite(p.ValueOhms) && p.ValueOhms > 0,
                $"Parts[{i}] (part {p.Number}).ValueOhms",
                "finite and > 0 ohm",
                p.ValueOhms
            );
            Require(
                double.IsFinite(p.StandardUncertaintyOhms) && p.StandardUncertaintyOhms >= 0,
                $"Parts[{i}] (part {p.Number}).StandardUncertaintyOhms",
                "finite and >= 0 ohm",
                p.StandardUncertaintyOhms
            );
        }

        for (int i = 0; i < input.Reels.Count; i++)
        {
            ReportReel r = input.Reels[i];
            Require(
                double.IsFinite(r.NominalOhms) && r.NominalOhms > 0,
                $"Reels[{i}].NominalOhms",
                "finite and > 0 ohm",
                r.NominalOhms
            );
            Require(
                double.IsFinite(r.TolerancePercent) && r.TolerancePercent > 0,
                $"Reels[{i}].TolerancePercent",
                "finite and > 0 %",
                r.TolerancePercent
            );
            Require(r.CupEdgesPpm.All(double.IsFinite), $"Reels[{i}].CupEdgesPpm", "finite ppm values", double.NaN);
        }

        for (int i = 0; i < input.DriftSamples.Count; i++)
        {
            ReportDriftSample s = input.DriftSamples[i];
            if (string.IsNullOrWhiteSpace(s.Channel))
            {
                throw new ArgumentException(
                    $"DriftSamples[{i}].Channel must be a non-empty channel name.",
                    nameof(input)
                );
            }

            Require(
                double.IsFinite(s.Ohms) && s.Ohms > 0,
                $"DriftSamples[{i}] ({s.Channel}).Ohms",
                "finite and > 0 ohm",
                s.Ohms
            );
            Require(
                s.TemperatureC is null || double.IsFinite(s.TemperatureC.Value),
                $"DriftSamples[{i}] ({s.Channel}).TemperatureC",
                "finite degC or null",
                s.TemperatureC ?? 0
            );
        }
    }

    private static void Require(bool ok, string field, string expected, double got)
    {
        if (!ok)
        {
            throw new ArgumentException($"Report input: {field} must be {expected}; got {got}.");
        }
    }
}
