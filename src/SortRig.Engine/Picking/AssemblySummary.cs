using System.Globalization;
using SortRig.Planning.Assembly;

namespace SortRig.Engine.Picking;

/// <summary>One line stating an assembly's sets, upper bound, gap, method, bound method, tie-break and time.</summary>
internal static class AssemblySummary
{
    /// <summary>"sets 12, upper bound 13, gap 7.7 %, method ..., bound: ..., tie-break: ..., 0.42 s".</summary>
    public static string Line(AssemblyResult r) =>
        string.Create(
            CultureInfo.InvariantCulture,
            $"sets {r.Sets.Count}, upper bound {r.UpperBound}, gap {100 * r.Gap:0.0} %"
                + $"{(r.ProvenOptimal ? " (proven optimal)" : "")}, "
                + $"method {r.Method}, bound: {r.BoundMethod}; tie-break: {r.TieBreak}; {r.Elapsed.TotalSeconds:0.00} s"
        );
}
