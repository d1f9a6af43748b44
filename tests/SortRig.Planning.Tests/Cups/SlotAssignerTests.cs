using SortRig.Planning.Cups;
using static SortRig.Planning.Tests.Cups.CupAssignerContractTests;

namespace SortRig.Planning.Tests.Cups;

public sealed class SlotAssignerTests
{
    [Fact]
    public void Slots_FillRowByRowThenTrayByTray()
    {
        var a = new SlotAssigner(new SlotOptions(trays: 2, rows: 2, columns: 3));
        var labels = Enumerable.Range(1, 7).Select(n => a.Assign(Part(n, 10e3, 0)).CupLabel).ToList();
        Assert.Equal(["T1-A01", "T1-A02", "T1-A03", "T1-B01", "T1-B02", "T1-B03", "T2-A01"], labels);
    }

    [Fact]
    public void FullTrays_Reject_AndUndoFreesTheLowestSlot()
    {
        var a = new SlotAssigner(new SlotOptions(trays: 1, rows: 1, columns: 3));
        for (var n = 1; n <= 3; n++)
        {
            a.Assign(Part(n, 10e3, 0));
        }

        var full = a.Assign(Part(4, 10e3, 0));
        Assert.True(full.IsReject);
        Assert.True(full.IsSlot); // the trays' reject bin is kept in the slot column too
        Assert.Equal(3, full.CupIndex);
        a.Undo(2);
        Assert.Equal("T1-A02", a.Assign(Part(5, 10e3, 0)).CupLabel);
        Assert.False(a.Assign(Part(6, 10e3, 0)).CompletesSet);
    }

    [Fact]
    public void UnwantedNominal_IsRejected()
    {
        var a = new SlotAssigner(new SlotOptions(nominals: [10e3]));
        Assert.True(a.Assign(Part(1, 20e3, 0)).IsReject);
        Assert.False(a.Assign(Part(2, 10e3, 0)).IsReject);
    }
}
