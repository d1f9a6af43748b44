namespace SortRig.Simulator.Physics;

/// <summary>
/// What is on the virtual reel: how many parts, which nominals, and how their true values,
/// tempcos, drifts and thermal time constants are spread. Validate with <see cref="Validate"/>.
/// </summary>
public sealed record ReelSpec
{
    /// <summary>Number of parts; 1 to 100 000. Default 200.</summary>
    public int Count { get; init; } = 200;

    /// <summary>Nominal values and their shares. Default: 10 kOhm (2 shares) and 20 kOhm (1 share), as for an R-2R
    /// ladder.</summary>
    public IReadOnlyList<NominalShare> Nominals { get; init; } = [new(10_000, 2), new(20_000, 1)];

    /// <summary>Tolerance half-width in percent of nominal; (0, 20]. Default 1 %.</summary>
    public double TolerancePercent { get; init; } = 1.0;

    /// <summary>Spread of true values within the tolerance. Default Normal with sigma 0.4 of the tolerance.</summary>
    public ValueDistribution Distribution { get; init; } = ValueDistribution.Normal(0.4);

    /// <summary>Mean tempco alpha in ppm/K; -1000 to 1000. Default 0.</summary>
    public double TempcoMeanPpmPerKelvin { get; init; }

    /// <summary>Standard deviation of the tempco over the reel in ppm/K; 0 to 500. Default 25.</summary>
    public double TempcoSigmaPpmPerKelvin { get; init; } = 25;

    /// <summary>Standard deviation of the per-part linear drift in ppm/h (mean 0); 0 to 100. Default 0.</summary>
    public double DriftSigmaPpmPerHour { get; init; }

    /// <summary>Mean thermal time constant of a part; 0.1 s to 10 min. Default 4 s.</summary>
    public TimeSpan ThermalTimeConstant { get; init; } = TimeSpan.FromSeconds(4);

    /// <summary>Relative spread of the per-part time constant (uniform ±); 0 to 0.9. Default 0.2.</summary>
    public double ThermalTimeConstantSpread { get; init; } = 0.2;

    /// <summary>Throws naming the first invalid option and its valid range.</summary>
    public ReelSpec Validate()
    {
        OptionGuard.InRange(Count, 1, 100_000, "ReelSpec.Count");
        OptionGuard.NotNull(Nominals, "ReelSpec.Nominals");
        if (Nominals.Count == 0)
        {
            throw new ArgumentException("ReelSpec.Nominals must hold at least one nominal value.", "ReelSpec.Nominals");
        }

        foreach (var share in Nominals)
        {
            OptionGuard.InRange(share.Ohms, 0.1, 1e8, "ReelSpec.Nominals[].Ohms", "ohm");
            OptionGuard.InRange(share.Weight, 1e-9, 1e9, "ReelSpec.Nominals[].Weight");
        }

        OptionGuard.InRange(TolerancePercent, 1e-6, 20, "ReelSpec.TolerancePercent", "%");
        OptionGuard.NotNull(Distribution, "ReelSpec.Distribution");
        OptionGuard.InRange(Distribution.Sigma, 1e-3, 5, "ReelSpec.Distribution.Sigma", "of tolerance");
        OptionGuard.InRange(Distribution.CentreGap, 0, 0.95, "ReelSpec.Distribution.CentreGap", "of tolerance");
        if (Distribution.AcceptanceProbability() < 1e-3)
        {
            throw new ArgumentException(
                $"ReelSpec.Distribution keeps fewer than 1 in 1000 draws (sigma {Distribution.Sigma}, gap "
                    + $"{Distribution.CentreGap}); widen sigma or narrow the gap.",
                "ReelSpec.Distribution"
            );
        }

        OptionGuard.InRange(TempcoMeanPpmPerKelvin, -1000, 1000, "ReelSpec.TempcoMeanPpmPerKelvin", "ppm/K");
        OptionGuard.InRange(TempcoSigmaPpmPerKelvin, 0, 500, "ReelSpec.TempcoSigmaPpmPerKelvin", "ppm/K");
        OptionGuard.InRange(DriftSigmaPpmPerHour, 0, 100, "ReelSpec.DriftSigmaPpmPerHour", "ppm/h");
        OptionGuard.InRange(
            ThermalTimeConstant,
            TimeSpan.FromSeconds(0.1),
            TimeSpan.FromMinutes(10),
            "ReelSpec.ThermalTimeConstant"
        );
        OptionGuard.InRange(ThermalTimeConstantSpread, 0, 0.9, "ReelSpec.ThermalTimeConstantSpread");
        return this;
    }
}
