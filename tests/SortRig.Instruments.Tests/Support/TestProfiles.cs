using System.Globalization;
using SortRig.Instruments.Profiles;

namespace SortRig.Instruments.Tests.Support;

/// <summary>The shipped profiles, optionally with the settle time or query timeout changed for fast tests.</summary>
internal static class TestProfiles
{
    public static MeterProfile Shipped(string family) =>
        MeterProfileLoader.Load(Path.Combine(RepoPaths.Instruments, family + ".yaml"));

    public static MeterProfile Simulator(double settleSeconds = 0, double queryTimeoutSeconds = 5)
    {
        var path = Path.Combine(RepoPaths.Instruments, "simulator.yaml");
        var text = File.ReadAllText(path)
            .Replace(
                "range_change_settle_s: 0.1",
                "range_change_settle_s: " + settleSeconds.ToString(CultureInfo.InvariantCulture),
                StringComparison.Ordinal
            )
            .Replace(
                "query_timeout_s: 5",
                "query_timeout_s: " + queryTimeoutSeconds.ToString(CultureInfo.InvariantCulture),
                StringComparison.Ordinal
            );
        return MeterProfileLoader.Parse(text, path);
    }
}
