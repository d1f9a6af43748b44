namespace SortRig.Measurement.Temperature;

/// <summary>
/// Callendar-Van Dusen resistance-temperature relation of a platinum resistance thermometer
/// (IEC 60751:2008 sec. 4.2): R(t) = R0 [1 + A t + B t^2 + C (t - 100) t^3], the C term only below 0 degC.
/// Valid from -200 degC to 850 degC. Immutable and thread-safe.
/// </summary>
public sealed record CallendarVanDusen
{
    /// <summary>Lowest temperature of the IEC 60751 range, degC.</summary>
    public const double MinimumCelsius = -200.0;

    /// <summary>Highest temperature of the IEC 60751 range, degC.</summary>
    public const double MaximumCelsius = 850.0;

    /// <summary>IEC 60751:2008 coefficient A, 1/degC.</summary>
    public const double IecA = 3.9083e-3;

    /// <summary>IEC 60751:2008 coefficient B, 1/degC^2.</summary>
    public const double IecB = -5.775e-7;

    /// <summary>IEC 60751:2008 coefficient C (below 0 degC only), 1/degC^4.</summary>
    public const double IecC = -4.183e-12;

    /// <summary>Creates a relation with explicit coefficients.</summary>
    /// <param name="r0">Resistance at 0 degC, ohms; finite and &gt; 0 (100 for Pt100, 1000 for Pt1000).</param>
    /// <param name="a">Coefficient A, 1/degC; finite and &gt; 0.</param>
    /// <param name="b">Coefficient B, 1/degC^2; finite and &lt; 0 (the closed-form inverse needs it).</param>
    /// <param name="c">Coefficient C, 1/degC^4; finite.</param>
    public CallendarVanDusen(double r0, double a = IecA, double b = IecB, double c = IecC)
    {
        if (!double.IsFinite(r0) || r0 <= 0)
        {
            throw new ArgumentOutOfRangeException(
                nameof(r0),
                r0,
                "R0 must be a finite resistance > 0 ohm (100 for Pt100, 1000 for Pt1000)."
            );
        }

        if (!double.IsFinite(a) || a <= 0)
        {
            throw new ArgumentOutOfRangeException(
                nameof(a),
                a,
                "Coefficient A must be finite and > 0 1/degC (IEC 60751: 3.9083e-3)."
            );
        }

        if (!double.IsFinite(b) || b >= 0)
        {
            throw new ArgumentOutOfRangeException(
                nameof(b),
                b,
                "Coefficient B must be finite and < 0 1/degC^2 (IEC 60751: -5.775e-7)."
            );
        }

        if (!double.IsFinite(c))
        {
            throw new ArgumentOutOfRangeException(
                nameof(c),
                c,
                "Coefficient C must be finite (IEC 60751: -4.183e-12 1/degC^4)."
            );
        }

        R0 = r0;
        A = a;
        B = b;
        C = c;
    }

    /// <summary>IEC 60751 Pt100 (R0 = 100 ohm).</summary>
    public static CallendarVanDusen Pt100 { get; } = new(100.0);

    /// <summary>IEC 60751 Pt1000 (R0 = 1000 ohm).</summary>
    public static CallendarVanDusen Pt1000 { get; } = new(1000.0);

    /// <summary>Resistance at 0 degC, ohms.</summary>
    public double R0 { get; }

    /// <summary>Coefficient A, 1/degC.</summary>
    public double A { get; }

    /// <summary>Coefficient B, 1/degC^2.</summary>
    public double B { get; }

    /// <summary>Coefficient C, 1/degC^4 (applies below 0 degC).</summary>
    public double C { get; }

    /// <summary>Resistance at <paramref name="celsius"/>, ohms.</summary>
    /// <param name="celsius">Temperature, degC, within -200..850.</param>
    public double Resistance(double celsius)
    {
        if (!double.IsFinite(celsius) || celsius < MinimumCelsius || celsius > MaximumCelsius)
        {
            throw new ArgumentOutOfRangeException(
                nameof(celsius),
                celsius,
                $"Temperature must be within {MinimumCelsius}..{MaximumCelsius} degC (IEC 60751 range)."
            );
        }

        return R0 * Ratio(celsius);
    }

    /// <summary>Temperature for a measured resistance, degC: closed form at or above 0 degC, Newton iteration
    /// below.</summary>
    /// <param name="ohms">Resistance, ohms, within R(-200 degC)..R(850 degC), widened by 0.01 % of R0 at both
    /// ends.</param>
    public double Temperature(double ohms) => CallendarVanDusenInverse.Solve(this, ohms);

    /// <summary>R(t)/R0 without range checks.</summary>
    internal double Ratio(double t)
    {
        double w = 1.0 + (A * t) + (B * t * t);
        return t < 0 ? w + (C * (t - 100.0) * t * t * t) : w;
    }

    /// <summary>d(R/R0)/dt without range checks, 1/degC.</summary>
    internal double RatioSlope(double t)
    {
        double d = A + (2.0 * B * t);
        return t < 0 ? d + (C * ((4.0 * t * t * t) - (300.0 * t * t))) : d;
    }
}
