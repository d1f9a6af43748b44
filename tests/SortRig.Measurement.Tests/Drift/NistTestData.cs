namespace SortRig.Measurement.Tests.Drift;

/// <summary>
/// The 1000-point white-noise test data of NIST SP 1065 (Riley, Handbook of Frequency Stability
/// Analysis, 2008) sec. 12 "test suite": n(1) = 1234567890, n(i+1) = 16807 n(i) mod 2147483647,
/// y(i) = n(i) / 2147483647, treated as fractional-frequency data with tau0 = 1 s.
/// Recipe from memory; the published overlapping ADEV values it reproduces to all 7 printed digits
/// (see AllanDeviationTests) confirm it, including that the seed itself is the first point.
/// </summary>
internal static class NistTestData
{
    public static double[] Generate()
    {
        var values = new double[1000];
        long n = 1234567890;
        for (int i = 0; i < values.Length; i++)
        {
            values[i] = n / 2147483647.0;
            n = 16807 * n % 2147483647;
        }

        return values;
    }
}
