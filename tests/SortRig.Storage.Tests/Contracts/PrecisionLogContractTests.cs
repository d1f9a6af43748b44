using Microsoft.Extensions.Time.Testing;
using SortRig.Storage.Contracts;
using SortRig.Storage.Migrations;

namespace SortRig.Storage.Tests.Contracts;

/// <summary>
/// Behaviour every precision log engine must show. Each test gets its own empty store; every call of
/// <see cref="CreateLogAsync"/> opens another log instance on that same store (a reopen after a crash, or a
/// second bench). The engine test classes supply the store.
/// </summary>
public abstract partial class PrecisionLogContractTests : IAsyncLifetime
{
    private readonly List<IPrecisionLog> _opened = [];

    /// <summary>Virtual clock of the logs; starts at the invented bench day 2026-03-02 08:00 UTC.</summary>
    protected FakeTimeProvider Clock { get; } = new(new DateTimeOffset(2026, 3, 2, 8, 0, 0, TimeSpan.Zero));

    protected PrecisionLogOptions Options => new() { TimeProvider = Clock };

    /// <summary>Opens a log on this test's store (creating the store on first call).</summary>
    protected abstract Task<IPrecisionLog> OpenLogAsync(PrecisionLogOptions options);

    /// <summary>Opens a log on this test's store that may read but not write.</summary>
    protected abstract Task<IPrecisionLog> OpenReadOnlyLogAsync();

    /// <summary>Opens a log on this test's store applying the given migrations instead of the embedded ones.</summary>
    private protected abstract Task<IPrecisionLog> OpenWithMigrationsAsync(IReadOnlyList<Migration> migrations);

    /// <summary>Asks the engine directly whether a table exists in this test's store.</summary>
    protected abstract Task<bool> TableExistsAsync(string table);

    /// <summary>Asks the engine directly how many rows schema_version holds.</summary>
    protected abstract Task<long> SchemaVersionRowsAsync();

    /// <summary>Runs SQL on a plain connection to the store, outside the code under test; returns the first
    /// value.</summary>
    protected abstract Task<object?> PlainScalarAsync(string sql);

    /// <summary>The embedded migration scripts of this engine.</summary>
    private protected abstract IReadOnlyList<Migration> EngineMigrations { get; }

    protected abstract Task DeleteStoreAsync();

    protected async Task<IPrecisionLog> CreateLogAsync(PrecisionLogOptions? options = null)
    {
        var log = await OpenLogAsync(options ?? Options);
        lock (_opened)
        {
            _opened.Add(log);
        }

        return log;
    }

    protected async Task<IPrecisionLog> TrackAsync(Task<IPrecisionLog> opening)
    {
        var log = await opening;
        lock (_opened)
        {
            _opened.Add(log);
        }

        return log;
    }

    public Task InitializeAsync() => Task.CompletedTask;

    public async Task DisposeAsync()
    {
        foreach (var log in _opened)
        {
            await log.DisposeAsync();
        }

        await DeleteStoreAsync();
    }
}
