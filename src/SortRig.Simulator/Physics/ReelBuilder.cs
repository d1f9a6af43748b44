using MathNet.Numerics.Distributions;
using MathNet.Numerics.Random;

namespace SortRig.Simulator.Physics;

/// <summary>Draws the parts of a reel from its spec, deterministically from a seed.</summary>
internal static class ReelBuilder
{
    public static IReadOnlyList<SimulatedPart> Build(ReelSpec spec, int seed)
    {
        spec.Validate();
        var rng = new MersenneTwister(seed, threadSafe: false);
        var weights = spec.Nominals.Select(n => n.Weight).ToArray();
        var parts = new SimulatedPart[spec.Count];
        for (var i = 0; i < parts.Length; i++)
        {
            // Fixed draw order per part keeps a reel identical for a seed whatever the options read later.
            var nominal = spec.Nominals[Categorical.Sample(rng, weights)].Ohms;
            parts[i] = Draw(spec, rng, i, nominal);
        }

        return parts;
    }

    /// <summary>One part of the given nominal drawn like a reel part (deviation, tempco, drift, time constant, in that
    /// order).</summary>
    internal static SimulatedPart Draw(ReelSpec spec, Random rng, int index, double nominal)
    {
        var deviation = DrawDeviation(spec.Distribution, rng) * spec.TolerancePercent / 100.0;
        var tempco = Gaussian(rng, spec.TempcoMeanPpmPerKelvin, spec.TempcoSigmaPpmPerKelvin);
        var drift = Gaussian(rng, 0, spec.DriftSigmaPpmPerHour);
        var spread = spec.ThermalTimeConstantSpread;
        var tau = spec.ThermalTimeConstant * ContinuousUniform.Sample(rng, 1 - spread, 1 + spread);
        return new SimulatedPart(index, nominal, nominal * (1 + deviation), tempco, drift, tau);
    }

    /// <summary>A deviation in units of the tolerance half-width.</summary>
    internal static double DrawDeviation(ValueDistribution distribution, Random rng)
    {
        switch (distribution.Kind)
        {
            case ValueDistributionKind.Uniform:
                return ContinuousUniform.Sample(rng, -1, 1);
            case ValueDistributionKind.Normal:
                return Normal.Sample(rng, 0, distribution.Sigma);
            default:
                // Truncated and Bimodal: rejection sampling; Validate() guarantees acceptance >= 1e-3.
                while (true)
                {
                    var d = Normal.Sample(rng, 0, distribution.Sigma);
                    var magnitude = Math.Abs(d);
                    var inBand = magnitude <= 1.0;
                    var outsideGap =
                        distribution.Kind != ValueDistributionKind.Bimodal || magnitude >= distribution.CentreGap;
                    if (inBand && outsideGap)
                    {
                        return d;
                    }
                }
        }
    }

    private static double Gaussian(Random rng, double mean, double sigma) =>
        sigma > 0 ? Normal.Sample(rng, mean, sigma) : mean;
}
