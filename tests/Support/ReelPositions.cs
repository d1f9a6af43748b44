using SortRig.Storage.Contracts;

namespace SortRig.Tests.Support;

/// <summary>
/// Where each logged record's part sits on the simulator's reel, so a test can ask the simulator's truth about it:
/// reel parts are fed in number order; a record that measured a part again (after a check) is the part its
/// predecessor names in <see cref="PartRecord.ReplacedBy"/> (schema version 6).
/// </summary>
internal static class ReelPositions
{
    /// <summary>Record number → reel position (0-based).</summary>
    public static Dictionary<int, int> Of(IReadOnlyList<PartRecord> stored)
    {
        var byId = stored.ToDictionary(p => p.Id);
        var replaced = stored
            .Where(p => p.ReplacedBy is not null)
            .ToDictionary(p => byId[p.ReplacedBy!.Value].Number, p => p.Number);
        var position = new Dictionary<int, int>();
        var next = 0;
        foreach (var p in stored.OrderBy(p => p.Number))
        {
            position[p.Number] = replaced.TryGetValue(p.Number, out var old) ? position[old] : next++;
        }

        return position;
    }
}
