namespace SortRig.Host.Tests.Lab.Support;

/// <summary>The lab server going away and coming back: a restart of the server, or a link that stalls.</summary>
internal interface IOutage : IAsyncDisposable
{
    /// <summary>What the benches pass as --db.</summary>
    string Database { get; }

    /// <summary>The lab the benches write to.</summary>
    LabStore Lab { get; }

    Task BeginAsync();

    Task EndAsync();
}

/// <summary>The bench's own server is shut down (fast: sessions ended, connections dropped) and started
/// again.</summary>
internal sealed class ServerRestart(OwnServer server, LabStore lab) : IOutage
{
    public string Database => lab.Writer;

    public LabStore Lab => lab;

    public static async Task<ServerRestart> CreateAsync()
    {
        var server = await OwnServer.StartAsync();
        try
        {
            return new ServerRestart(server, await LabStore.CreateAsync(server.ConnectionString));
        }
        catch
        {
            await server.DisposeAsync(); // never leave a server running
            throw;
        }
    }

    public Task BeginAsync() => server.StopAsync();

    public Task EndAsync() => server.StartAgainAsync();

    public async ValueTask DisposeAsync()
    {
        await lab.DisposeAsync();
        await server.DisposeAsync();
    }
}

/// <summary>
/// The link to the suite's server stops forwarding (the proxy holds the bytes). The bench sets a 3 s command and
/// connect timeout so the stall is found out quickly (the default is 15 s, PrecisionLogOptions.CommandTimeout).
/// </summary>
internal sealed class StalledLink(StallingProxy proxy, LabStore lab) : IOutage
{
    public string Database => lab.WriterVia(proxy.Port) + ";Command Timeout=3;Timeout=3;Keepalive=1";

    public LabStore Lab => lab;

    public static async Task<StalledLink> CreateAsync()
    {
        var lab = await LabStore.CreateAsync();
        var port = new Npgsql.NpgsqlConnectionStringBuilder(LabStore.ServerFromEnvironment()).Port;
        return new StalledLink(new StallingProxy(port), lab);
    }

    public Task BeginAsync()
    {
        proxy.Stall();
        return Task.CompletedTask;
    }

    public Task EndAsync()
    {
        proxy.Resume();
        return Task.CompletedTask;
    }

    public async ValueTask DisposeAsync()
    {
        await proxy.DisposeAsync();
        await lab.DisposeAsync();
    }
}
