namespace SortRig.Measurement.Drift;

/// <summary>One logged reading of a part under drift observation.</summary>
/// <param name="Time">When the reading was taken (injected TimeProvider).</param>
/// <param name="Ohms">Measured resistance, ohms; finite and &gt; 0.</param>
/// <param name="TemperatureC">Ambient or part temperature at that time, degC; null when not logged.</param>
public readonly record struct DriftSample(DateTimeOffset Time, double Ohms, double? TemperatureC);
