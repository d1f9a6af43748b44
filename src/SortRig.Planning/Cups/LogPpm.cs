namespace SortRig.Planning.Cups;

/// <summary>
/// Deviations on a log scale, y = ln(1 + ppm·1e-6)·1e6 ("log ppm"). A matched cup must keep the worst-case ratio
/// max/min − 1 within the tolerance; on this scale that is a fixed width ln(1 + tol·1e-6)·1e6 wherever the band
/// sits, so bands of one width tile it exactly.
/// </summary>
internal static class LogPpm
{
    public static double From(double ppm) => Math.Log(1 + (ppm * 1e-6)) * 1e6;

    public static double ToPpm(double y) => (Math.Exp(y * 1e-6) - 1) * 1e6;
}
