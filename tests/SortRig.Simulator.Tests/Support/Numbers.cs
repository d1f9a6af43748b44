using System.Globalization;

namespace SortRig.Simulator.Tests.Support;

internal static class Numbers
{
    public const double Overflow = 9.9e37;

    public static double Parse(string text) => double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);

    public static double[] ParseList(string text) => text.Split(',').Select(Parse).ToArray();

    public static double RmsAboutMean(IReadOnlyList<double> values)
    {
        var mean = values.Average();
        return Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Count - 1));
    }
}
