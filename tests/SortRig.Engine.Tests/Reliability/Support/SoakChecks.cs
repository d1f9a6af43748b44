using SortRig.Simulator.Faults;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Engine.Tests.Reliability.Support;

/// <summary>The checks every soak must pass: nothing lost, nothing doubled, every value and cup true, the operator
/// told.</summary>
internal static class SoakChecks
{
    /// <summary>The data-loss figures of a soak: parts lost, announced twice, in a cup their truth does not call
    /// for.</summary>
    public static (int Lost, int Doubled, int Wrong) Tally(SoakResult r)
    {
        var stored = r.Parts.Where(p => p.State == PartState.Announced).Select(p => p.Number).ToHashSet();
        var heard = Announcements.Cups(r.Heard);
        var lost = Enumerable.Range(1, r.Options.Parts).Count(n => !stored.Contains(n) || heard.All(h => h.Part != n));
        var doubled = heard.Count - heard.Select(h => h.Part).Distinct().Count();
        var wrong = TruthCheck.Compare(r.Options, r.Parts, number => r.Truth[number]).Problems.Count;
        return (lost, doubled, wrong);
    }

    public static void AssertSurvived(SoakResult r, ITestOutputHelper output)
    {
        var n = r.Options.Parts;
        foreach (var line in r.Heard.Split('\n').Where(l => l.Contains(": unstable", StringComparison.Ordinal)))
        {
            output.WriteLine(line);
        }

        Assert.True(r.Integrity.IsOk, string.Join("; ", r.Integrity.Problems));
        Assert.Equal(0, r.DwellTimeouts); // no part was pulled unmeasured
        Assert.Equal(n, r.Outcome.PartsRecorded);
        Assert.Equal(Enumerable.Range(1, n), r.Parts.Select(p => p.Number));
        Assert.All(r.Parts, p => Assert.Equal(PartState.Announced, p.State));
        Assert.All(r.Parts, p =>
            Assert.True(r.ReadingCounts[p.Id] >= 8, $"part {p.Number} has {r.ReadingCounts[p.Id]} readings")
        );

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
            output.WriteLine($"{group.Count(), 5} x {group.Key}");
        }

        foreach (var kind in FaultSoak.Kinds)
        {
            Assert.True(r.Injected[kind] > 0, $"no {kind} injected");
        }

        // The operator was told of every recovery, and each kind of fault was heard as what it is.
        Assert.Equal(r.Outcome.Faults, notes.Count(note => note.StartsWith("meter", StringComparison.Ordinal)));
        Assert.Contains(notes, note =>
            note.Contains("connection lost", StringComparison.Ordinal)
            || note.Contains("no answer in time", StringComparison.Ordinal)
        );
        Assert.Contains(notes, note => note.Contains("no answer in time", StringComparison.Ordinal));
        Assert.Contains(notes, note => note.Contains("garbled reply", StringComparison.Ordinal));
        Assert.Contains(notes, note => note.Contains("instrument error -310", StringComparison.Ordinal));
        Assert.Contains(notes, note => note.Contains("lost its range/NPLC settings", StringComparison.Ordinal));
    }

    /// <summary>
    /// The suite's soak must inject at least 1 000 faults over at least 500 parts (the floor the
    /// reliability issue sets); a scripted soak of another size is held to its own figures only.
    /// </summary>
    public static void AssertSuiteFloor(SoakSettings s, SoakResult r)
    {
        if (s.IsSuiteSize)
        {
            Assert.True(r.Options.Parts >= 500, $"only {r.Options.Parts} parts");
            Assert.True(r.Injected.Values.Sum() >= 1000, $"only {r.Injected.Values.Sum()} faults injected");
        }
    }

    private static string Kind(string note) => note.Length > 60 ? note[..60] : note;
}
