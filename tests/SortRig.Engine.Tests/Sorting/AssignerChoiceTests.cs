using SortRig.Engine.Announcing;
using SortRig.Engine.Sorting;
using SortRig.Storage;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Sorting;

/// <summary>The planning layer's cup planners plug into the sort through Sort:Assigner (on a virtual clock).</summary>
public sealed class AssignerChoiceTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-assigner-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Theory]
    [InlineData(AssignerKind.Slots)]
    [InlineData(AssignerKind.Adaptive)]
    public async Task Sort_WithAssigner_StoresItsLabelsInTheRightColumn(AssignerKind assigner)
    {
        var options = new SortOptions
        {
            Database = Path.Combine(_dir, assigner + ".db"),
            Session = assigner.ToString(),
            Parts = 8,
            Seed = 77,
            Speech = false,
            Live = false,
            Assigner = assigner,
        };

        var outcome = await new VirtualSort(new PlainTextAnnouncer(TextWriter.Null)).RunAsync(options);

        await using var log = await PrecisionLogFactory.OpenAsync(options.Database, null, default);
        var parts = await log.GetPartsAsync(outcome.SessionId, default);
        Assert.Equal(8, parts.Count);
        if (assigner == AssignerKind.Slots)
        {
            Assert.All(parts, p => Assert.Null(p.CupLabel));
            Assert.All(parts, p => Assert.Matches(@"^T\d+-[A-Z]\d{2}$", p.SlotLabel!));
            Assert.Equal(parts.Count, parts.Select(p => p.SlotLabel).Distinct().Count());
        }
        else
        {
            Assert.All(parts, p => Assert.Null(p.SlotLabel));
            Assert.All(parts, p => Assert.Matches("^[A-Z]$", p.CupLabel!));
        }
    }
}
