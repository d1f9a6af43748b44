using System.Globalization;
using SortRig.Engine.Picking;

namespace SortRig.Engine.Building;

/// <summary>Where a build stands after a part: counts, the assembler's answer when it was asked, and
/// guidance.</summary>
/// <param name="Target">The target.</param>
/// <param name="Count">Bounds from part counts.</param>
/// <param name="Searched">True when the set assembler was asked (the counts allowed the target).</param>
/// <param name="SetsFound">Sets the assembler found from the parts on hand; 0 when it was not asked.</param>
/// <param name="Plan">When complete: the pick list of the target's sets (trimmed to the target), else null.</param>
/// <param name="FeedNext">Nominal to feed next, ohms; null when complete.</param>
/// <param name="Band">Where feasible: a band of values (ppm from <paramref name="FeedNext"/>) one part of which would
/// complete the target with the parts on hand; null when no single part does or it was not probed.</param>
internal sealed record BuildStatus(
    BuildTarget Target,
    BuildCount Count,
    bool Searched,
    int SetsFound,
    PlanOutcome? Plan,
    double? FeedNext,
    (double LowPpm, double HighPpm)? Band
)
{
    /// <summary>True when the target's sets can be formed from the parts on hand.</summary>
    public bool Complete => Plan is not null;

    /// <summary>One plain line of guidance: sets in hand, what is still needed per nominal, what to feed
    /// next.</summary>
    public string Line()
    {
        var c = CultureInfo.InvariantCulture;
        var name = Target.Recipe.Name;
        if (Complete)
        {
            return string.Create(c, $"sets complete: {Target.Sets} set(s) of {name} are in hand");
        }

        var found = Searched
            ? string.Create(c, $"{SetsFound} of {Target.Sets} set(s) of {name} in hand")
            : string.Create(c, $"0 of {Target.Sets} set(s) of {name} yet (too few parts)");
        var needs = string.Join(
            ", ",
            Count.Needs.Select(n => string.Create(c, $"{Ohms(n.Nominal)} {n.StillNeeded} more"))
        );
        var line = string.Create(c, $"{found}; still needed at least {Count.MoreAtLeast} part(s) ({needs})");
        if (FeedNext is { } feed)
        {
            line += "; feed " + Ohms(feed) + " next";
        }

        if (Band is { } b && FeedNext is { } n2)
        {
            line += string.Create(
                c,
                $"; a {Ohms(n2)} part between {b.LowPpm:+0;-0;0} and {b.HighPpm:+0;-0;0} ppm completes the sets"
            );
        }

        return line;
    }

    /// <summary>"10k", "4.99k", "1M", "470" ohms.</summary>
    public static string Ohms(double ohms) =>
        ohms switch
        {
            >= 1e6 => (ohms / 1e6).ToString("0.###", CultureInfo.InvariantCulture) + "M",
            >= 1e3 => (ohms / 1e3).ToString("0.###", CultureInfo.InvariantCulture) + "k",
            _ => ohms.ToString("0.###", CultureInfo.InvariantCulture),
        };
}
