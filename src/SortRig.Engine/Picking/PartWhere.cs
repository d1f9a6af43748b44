using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Picking;

/// <summary>Where a part is to be found, in words, from the log's fields.</summary>
internal static class PartWhere
{
    /// <summary>
    /// The library location when one was set ("bag 7"), else the slot ("T1-A07"), else the cup ("cup A"). With
    /// <paramref name="qualify"/> a slot or cup is prefixed by its session ("S3 cup A"), since cup A of one session is
    /// not cup A of another. Empty when the log knows nothing.
    /// </summary>
    public static string Of(PartRecord part, bool qualify)
    {
        if (!string.IsNullOrWhiteSpace(part.Location))
        {
            return part.Location;
        }

        var place = SlotOf(part) ?? (CupOf(part) is { } cup ? "cup " + cup : null);
        return place is null ? ""
            : qualify ? $"S{part.SessionId} {place}"
            : place;
    }

    /// <summary>The part's own slot, if it has one: a slot label, or a cup label that is not one of our cup
    /// letters.</summary>
    public static string? SlotOf(PartRecord part) =>
        part.SlotLabel ?? (part.CupLabel is { } c && c != CupLabels.Reject && CupLabels.IndexOf(c) < 0 ? c : null);

    /// <summary>The part's cup: its cup label when that is one of our cup letters or the reject cup, else
    /// null.</summary>
    public static string? CupOf(PartRecord part) =>
        part.CupLabel is { } c && (c == CupLabels.Reject || CupLabels.IndexOf(c) >= 0) ? c : null;

    /// <summary>True when the part sits in a shared cup (a regular cup letter or the reject cup) and nowhere more
    /// exact.</summary>
    public static bool InSharedCup(PartRecord part) =>
        string.IsNullOrWhiteSpace(part.Location) && SlotOf(part) is null && CupOf(part) is not null;

    /// <summary>True when the part went to the reject cup and was not stored anywhere else since.</summary>
    public static bool InRejectCup(PartRecord part) => InSharedCup(part) && part.CupLabel == CupLabels.Reject;
}
