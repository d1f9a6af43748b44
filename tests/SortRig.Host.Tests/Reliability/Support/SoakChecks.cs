using SortRig.Simulator.Faults;
using SortRig.Storage.Contracts;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Reliability.Support;

/// <summary>The checks every soak must pass: nothing lost, nothing doubled, every value and cup true, the operator told.</summary>
internal static class SoakChecks
{
    public static void AssertSurvived(SoakResult r, ITestOutputHelper output)
    {
        var n = r.Options.Parts;
        Assert.True(r.Integrity.IsOk, string.Join("; ", r.Integrity.Problems));
        Assert.Equal(0, r.DwellTimeouts); // no part was pulled unmeasured
        Assert.Equal(n, r.Outcome.PartsRecorded);
        Assert.Equal(Enumerable.Range(1, n), r.Parts.Select(p => p.Number));
        Assert.All(r.Parts, p => Assert.Equal(PartState.Announced, p.State));
        Assert.All(r.Parts, p => Assert.True(r.ReadingCounts[p.Id] >= 8, $"part {p.Number} has {r.ReadingCounts[p.Id]} readings"));

        var (problems, onEdge) = TruthCheck.Compare(r.Options, r.Parts, number => r.Truth[number]);
        output.WriteLine($"{onEdge} parts on a band edge within their uncertainty");
        Assert.Empty(problems);
        Assert.True(onEdge <= n / 20, $"{onEdge} parts sat on a band edge");

        // Each part announced exactly once, with the cup it was stored with.
        var heard = Announcements.Cups(r.Heard);
        Assert.Equal(r.Parts.Select(p => $"{p.Number}:{p.CupLabel}"), heard.Select(h => $"{h.Part}:{h.Cup}"));

        var notes = Announcements.Notes(r.Heard);
        foreach (var group in notes.GroupBy(Kind).OrderByDescending(g => g.Count()))
        {
            output.WriteLine($"{group.Count(),5} x {group.Key}");
        }

        foreach (var kind in Enum.GetValues<FaultKind>())
        {
            Assert.True(r.Injected[kind] > 0, $"no {kind} injected");
        }
    }

    private static string Kind(string note) => note.Length > 60 ? note[..60] : note;
}
