using SortRig.Engine.Sorting;
using SortRig.Engine.Typed;
using SortRig.Instruments.Profiles;
using SortRig.Instruments.Resources;
using SortRig.Measurement.Ranging;

namespace SortRig.Host.Cli;

/// <summary>Checks a TYPED::profile resource before anything starts: the profile loads and one of its ranges shows the
/// batch.</summary>
internal static class TypedInputCheck
{
    /// <summary>Null when the resource is not typed or all is well; else one line naming the resource flag.</summary>
    public static string? Problem(SortOptions options, string resourceName)
    {
        if (ResourceStringParser.Parse(options.Resource) is not TypedResource typed)
        {
            return null;
        }

        try
        {
            var meter = TypedProfileLocator.Load(typed.Profile);
            HandRangeRule.Recommend(
                meter,
                new HandRangeRequest(options.Nominal, options.StockTolerance, options.MatchTolerance)
            );
            return null;
        }
        catch (Exception e) when (e is FileNotFoundException or ProfileException or ArgumentException)
        {
            return $"{resourceName}: {e.Message}";
        }
    }
}
