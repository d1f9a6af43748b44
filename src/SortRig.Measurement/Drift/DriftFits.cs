namespace SortRig.Measurement.Drift;

/// <summary>A fitted coefficient with its standard error (1 sigma) from the regression covariance.</summary>
/// <param name="Value">Estimate, in the unit of the owning property.</param>
/// <param name="StandardError">Standard error of the estimate, same unit; NaN when the fit has no residual degrees of
/// freedom.</param>
public readonly record struct Coefficient(double Value, double StandardError);

/// <summary>Drift of a resistance over time: ppm = intercept + slope * hours since <paramref name="Origin"/>.</summary>
/// <param name="PpmPerHour">Drift rate, ppm of <paramref name="ReferenceOhms"/> per hour, with standard error.</param>
/// <param name="InterceptPpm">Fitted deviation at <paramref name="Origin"/>, ppm.</param>
/// <param name="ReferenceOhms">Resistance the ppm are relative to, ohms (mean of the samples unless given).</param>
/// <param name="Origin">Time of the earliest sample; hours are counted from here.</param>
/// <param name="SpanHours">Time between the earliest and latest sample, hours.</param>
/// <param name="ResidualStdDevPpm">Standard deviation of the residuals (n - 2 degrees of freedom), ppm.</param>
/// <param name="Count">Number of samples fitted.</param>
public sealed record DriftFit(
    Coefficient PpmPerHour,
    double InterceptPpm,
    double ReferenceOhms,
    DateTimeOffset Origin,
    double SpanHours,
    double ResidualStdDevPpm,
    int Count
);

/// <summary>Temperature coefficient: ppm = intercept + slope * (T - <paramref
/// name="ReferenceTemperatureC"/>).</summary>
/// <param name="PpmPerKelvin">Tempco, ppm of <paramref name="ReferenceOhms"/> per kelvin, with standard error.</param>
/// <param name="InterceptPpm">Fitted deviation at the reference temperature, ppm.</param>
/// <param name="ReferenceOhms">Resistance the ppm are relative to, ohms.</param>
/// <param name="ReferenceTemperatureC">Mean temperature of the samples, degC.</param>
/// <param name="TemperatureSpanK">Highest minus lowest temperature, K.</param>
/// <param name="ResidualStdDevPpm">Standard deviation of the residuals (n - 2 degrees of freedom), ppm.</param>
/// <param name="Count">Number of samples fitted.</param>
public sealed record TempcoFit(
    Coefficient PpmPerKelvin,
    double InterceptPpm,
    double ReferenceOhms,
    double ReferenceTemperatureC,
    double TemperatureSpanK,
    double ResidualStdDevPpm,
    int Count
);

/// <summary>Joint fit ppm = b0 + drift * hours + tempco * (T - reference temperature), separating drift from
/// tempco.</summary>
/// <param name="PpmPerHour">Drift rate at constant temperature, ppm/h, with standard error.</param>
/// <param name="PpmPerKelvin">Tempco at constant time, ppm/K, with standard error.</param>
/// <param name="InterceptPpm">Fitted deviation at the origin and the reference temperature, ppm.</param>
/// <param name="ReferenceOhms">Resistance the ppm are relative to, ohms.</param>
/// <param name="Origin">Time of the earliest sample.</param>
/// <param name="ReferenceTemperatureC">Mean temperature of the samples, degC.</param>
/// <param name="ResidualStdDevPpm">Standard deviation of the residuals (n - 3 degrees of freedom), ppm.</param>
/// <param name="Count">Number of samples fitted.</param>
public sealed record DriftTempcoFit(
    Coefficient PpmPerHour,
    Coefficient PpmPerKelvin,
    double InterceptPpm,
    double ReferenceOhms,
    DateTimeOffset Origin,
    double ReferenceTemperatureC,
    double ResidualStdDevPpm,
    int Count
);
