using SortRig.Host.PlanVerb;
using SortRig.Host.VerbSupport;
using SortRig.Storage;

namespace SortRig.Host.Tests.Planning;

/// <summary>A session name given to plan, reach or order: the newest of several is taken, and never silently.</summary>
public sealed class SessionLookupTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-lookup-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task SeveralSessionsWithTheName_TakesTheNewest_AndSaysWhichAndHowToTakeAnother()
    {
        await using var log = await PrecisionLogFactory.OpenAsync(Path.Combine(_dir, "l.db"), null, default);
        var first = await log.OpenOrResumeSessionAsync(new("bench"), default);
        await log.FinishSessionAsync(first.Session.Id, default);
        var second = await log.OpenOrResumeSessionAsync(new("bench"), default); // a rerun of the demo: a new session
        var told = new List<string>();

        var found = await SessionLookup.FindAsync(log, "bench", default, told.Add);

        Assert.Equal(second.Session.Id, found.Id);
        var line = Assert.Single(told);
        Assert.Contains(
            $"2 sessions are named 'bench': taking the newest (id {second.Session.Id}",
            line,
            StringComparison.Ordinal
        );
        Assert.Contains($"the others have ids {first.Session.Id}", line, StringComparison.Ordinal);
        Assert.Equal(
            first.Session.Id,
            (
                await SessionLookup.FindAsync(
                    log,
                    first.Session.Id.ToString(System.Globalization.CultureInfo.InvariantCulture),
                    default,
                    told.Add
                )
            ).Id
        );
        Assert.Single(told); // by id: nothing to say
    }

    [Fact]
    public async Task NoSuchSession_NamesTheNewest()
    {
        await using var log = await PrecisionLogFactory.OpenAsync(Path.Combine(_dir, "l.db"), null, default);
        await log.OpenOrResumeSessionAsync(new("ladder"), default);

        var e = await Assert.ThrowsAsync<VerbException>(() => SessionLookup.FindAsync(log, "bnech", default));

        Assert.Contains(
            "no session named or numbered 'bnech'; newest sessions: 'ladder'",
            e.Message,
            StringComparison.Ordinal
        );
    }
}
