using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

/// <summary>The build target kept with a session (schema version 4): read back as written, replaced, refused for no
/// session.</summary>
public abstract partial class PrecisionLogContractTests
{
    private static readonly BuildTargetRecord s_target = new(
        "ladder-pair",
        "/recipes/ladder-pair.yaml",
        "recipe: ladder-pair\nform: matched\n",
        2,
        "/tmp/sets.csv"
    );

    [SkippableFact]
    public async Task BuildTarget_WrittenThenReopened_ReadsBackTheSame()
    {
        var log = await CreateLogAsync();
        var (session, _) = await Bench.StartAsync(log);
        Assert.Null(await log.GetBuildTargetAsync(session.Session.Id, CancellationToken.None));

        await log.SetBuildTargetAsync(session.Session.Id, s_target, CancellationToken.None);
        await log.DisposeAsync();
        var reopened = await CreateLogAsync();
        Assert.Equal(s_target, await reopened.GetBuildTargetAsync(session.Session.Id, CancellationToken.None));
    }

    [SkippableFact]
    public async Task BuildTarget_SetAgain_ReplacesTheFirst()
    {
        var log = await CreateLogAsync();
        var (session, _) = await Bench.StartAsync(log);
        await log.SetBuildTargetAsync(session.Session.Id, s_target, CancellationToken.None);
        var other = s_target with { Sets = 5, CsvPath = null };
        await log.SetBuildTargetAsync(session.Session.Id, other, CancellationToken.None);
        Assert.Equal(other, await log.GetBuildTargetAsync(session.Session.Id, CancellationToken.None));
    }

    [SkippableFact]
    public async Task BuildTarget_NoSuchSession_NotFound()
    {
        var log = await CreateLogAsync();
        var error = await Assert.ThrowsAsync<StorageException>(() =>
            log.SetBuildTargetAsync(987_654, s_target, CancellationToken.None)
        );
        Assert.Equal(StorageFault.NotFound, error.Fault);
        await Assert.ThrowsAsync<ArgumentOutOfRangeException>(() =>
            log.SetBuildTargetAsync(1, s_target with { Sets = 0 }, CancellationToken.None)
        );
    }
}
