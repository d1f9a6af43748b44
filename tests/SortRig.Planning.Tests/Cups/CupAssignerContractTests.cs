using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Cups;

namespace SortRig.Planning.Tests.Cups;

/// <summary>Behaviour every <see cref="ICupAssigner"/> owes the sorting pipeline.</summary>
public sealed class CupAssignerContractTests
{
    public static TheoryData<string> Kinds => new(["band", "adaptive", "slot"]);

    internal static ICupAssigner Make(string kind) =>
        kind switch
        {
            "band" => new BandCupAssigner(new BandCupOptions(8, 1000, 10e3, 1.0, partsPerSet: 4)),
            "adaptive" => new AdaptiveCupPlanner(
                new AdaptiveCupOptions(
                    8,
                    1000,
                    1.0,
                    new Dictionary<double, int> { [10e3] = 4, [20e3] = 1 },
                    learnCount: 30
                )
            ),
            _ => new SlotAssigner(new SlotOptions(trays: 2, rows: 4, columns: 25)),
        };

    internal static CupRequest Part(long n, double nominal, double ppm, double uPpm = 10) =>
        new(
            n,
            nominal,
            new MeasuredValue(nominal * (1 + (ppm * 1e-6)), nominal * uPpm * 1e-6, nominal * uPpm * 0.5e-6)
        );

    [Theory]
    [MemberData(nameof(Kinds))]
    public void EveryDecision_SaysWhetherItNamesASlotOrACup(string kind)
    {
        // Slot assigners name tray places (their reject bin included); band and adaptive assigners name shared cups.
        var a = Make(kind);
        var decisions = Enumerable.Range(1, 60).Select(n => a.Assign(Part(n, 10e3, ((n % 11) * 300) - 1500))).ToList();
        Assert.All(decisions, d => Assert.Equal(kind == "slot", d.IsSlot));
    }

    [Theory]
    [MemberData(nameof(Kinds))]
    public void RandomAssignUndoAndDuplicates_NeverPlaceAPartTwice(string kind)
    {
        var a = Make(kind);
        var rng = new Random(5);
        var placed = new HashSet<long>();
        for (var step = 0; step < 400; step++)
        {
            var n = (long)rng.Next(1, 150);
            if (placed.Contains(n) && rng.Next(3) == 0)
            {
                a.Undo(n);
                placed.Remove(n);
            }
            else if (placed.Contains(n))
            {
                var before = a.Counts.Sum(c => c.Count);
                Assert.Throws<InvalidOperationException>(() => a.Assign(Part(n, 10e3, 0)));
                Assert.Equal(before, a.Counts.Sum(c => c.Count));
            }
            else
            {
                a.Assign(Part(n, rng.Next(10) == 0 ? 20e3 : 10e3, (rng.NextDouble() - 0.5) * 25_000));
                placed.Add(n);
            }

            Assert.Equal(placed.Count, a.Counts.Sum(c => c.Count));
        }

        Assert.Throws<InvalidOperationException>(() => a.Undo(10_000));
    }

    [Theory]
    [MemberData(nameof(Kinds))]
    public void Restore_FromHistory_ReproducesCountsAndLaterDecisions(string kind)
    {
        var first = Make(kind);
        var rng = new Random(17);
        var history = new List<(CupRequest, string)>();
        for (var n = 1; n <= 150; n++)
        {
            var req = Part(n, 10e3, (rng.NextDouble() - 0.5) * 12_000);
            history.Add((req, first.Assign(req).CupLabel));
        }

        var second = Make(kind);
        second.Restore(history);
        Assert.Equal(first.Counts, second.Counts);
        var next = Part(999, 10e3, 123);
        Assert.Equal(first.Assign(next), second.Assign(next));
    }

    [Theory]
    [MemberData(nameof(Kinds))]
    public void Undo_TakesThePartOut_AndItCanBeAssignedAgain(string kind)
    {
        var a = Make(kind);
        var d = a.Assign(Part(1, 10e3, 200));
        Assert.Equal(1, a.Counts.Single(c => c.CupLabel == d.CupLabel).Count);
        a.Undo(1);
        Assert.DoesNotContain(a.Counts, c => c.CupLabel == d.CupLabel && c.Count > 0);
        Assert.Equal(d.CupLabel, a.Assign(Part(1, 10e3, 200)).CupLabel);
    }

    [Fact]
    public void Restore_UnknownLabel_IsRefused()
    {
        var e = Assert.Throws<ArgumentException>(() => Make("band").Restore([(Part(1, 10e3, 0), "Z")]));
        Assert.Contains("'Z'", e.Message, StringComparison.Ordinal);
    }
}
