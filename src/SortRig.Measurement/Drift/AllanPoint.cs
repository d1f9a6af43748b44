namespace SortRig.Measurement.Drift;

/// <summary>Overlapping Allan deviation at one averaging time, with its confidence interval.</summary>
/// <param name="AveragingFactor">m: tau = m * tau0.</param>
/// <param name="TauSeconds">Averaging time tau, seconds.</param>
/// <param name="Deviation">sigma_y(tau), dimensionless (fractional; multiply by 1e6 for ppm).</param>
/// <param name="TermCount">Number of squared second differences averaged, M - 2m + 1 for M frequency values.</param>
/// <param name="DegreesOfFreedom">Equivalent degrees of freedom assuming white frequency noise (NIST SP 1065 simple
/// approximation).</param>
/// <param name="Lower">Lower end of the 68.3 % chi-square interval for sigma_y, dimensionless.</param>
/// <param name="Upper">Upper end of the 68.3 % chi-square interval for sigma_y, dimensionless.</param>
public sealed record AllanPoint(
    int AveragingFactor,
    double TauSeconds,
    double Deviation,
    int TermCount,
    double DegreesOfFreedom,
    double Lower,
    double Upper
);
