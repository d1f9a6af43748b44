namespace SortRig.Measurement.Networks;

/// <summary>
/// Series and parallel combinations of resistors and their uncertainty propagation. Pure arithmetic.
/// Every resistance is in ohms and must be finite and &gt; 0.
/// </summary>
public static class ResistorNetwork
{
    /// <summary>Series: R = Σ R_i. At least one resistor.</summary>
    public static double Series(params double[] r)
    {
        Check(r);
        var sum = 0.0;
        foreach (var x in r)
        {
            sum += x;
        }

        return sum;
    }

    /// <summary>Parallel: R = 1 / Σ (1/R_i). At least one resistor.</summary>
    public static double Parallel(params double[] r)
    {
        Check(r);
        var conductance = 0.0;
        foreach (var x in r)
        {
            conductance += 1.0 / x;
        }

        return 1.0 / conductance;
    }

    /// <summary>Series with uncertainty: c_i = ∂R/∂R_i = 1, u_c² = Σ u_i² (JCGM 100:2008 eq. 10).</summary>
    public static NetworkValue Series(params ResistorEstimate[] parts)
    {
        var values = ValuesOf(parts);
        var sensitivities = new double[parts.Length];
        Array.Fill(sensitivities, 1.0);
        return Combine(Series(values), parts, sensitivities);
    }

    /// <summary>Parallel with uncertainty: c_i = ∂R/∂R_i = (R/R_i)², u_c² = Σ (c_i u_i)² (JCGM 100:2008 eq.
    /// 10).</summary>
    public static NetworkValue Parallel(params ResistorEstimate[] parts)
    {
        var values = ValuesOf(parts);
        var total = Parallel(values);
        var sensitivities = new double[parts.Length];
        for (var i = 0; i < parts.Length; i++)
        {
            var ratio = total / values[i];
            sensitivities[i] = ratio * ratio;
        }

        return Combine(total, parts, sensitivities);
    }

    private static NetworkValue Combine(double value, ResistorEstimate[] parts, double[] sensitivities)
    {
        var sum = 0.0;
        for (var i = 0; i < parts.Length; i++)
        {
            var u = parts[i].StandardUncertainty;
            if (!double.IsFinite(u) || u < 0)
            {
                throw new ArgumentOutOfRangeException(
                    nameof(parts),
                    u,
                    $"Resistor {i}: standard uncertainty must be finite and >= 0 ohms."
                );
            }

            var contribution = sensitivities[i] * u;
            sum += contribution * contribution;
        }

        return new NetworkValue(value, Math.Sqrt(sum), sensitivities);
    }

    private static double[] ValuesOf(ResistorEstimate[] parts)
    {
        ArgumentNullException.ThrowIfNull(parts);
        return Array.ConvertAll(parts, p => p.Value);
    }

    private static void Check(double[] r)
    {
        ArgumentNullException.ThrowIfNull(r);
        if (r.Length == 0)
        {
            throw new ArgumentException("A network needs at least one resistor.", nameof(r));
        }

        for (var i = 0; i < r.Length; i++)
        {
            if (!double.IsFinite(r[i]) || r[i] <= 0)
            {
                throw new ArgumentOutOfRangeException(
                    nameof(r),
                    r[i],
                    $"Resistor {i}: value must be finite and > 0 ohms."
                );
            }
        }
    }
}
