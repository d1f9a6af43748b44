using System.Diagnostics;

namespace SortRig.Host.Tests.Lab.Support;

/// <summary>
/// A PostgreSQL server of this test's own (scripts/pg-test-server in a fresh folder), so it can be stopped and
/// started again without disturbing the suite's shared server. Restarts keep the port. Stopped on dispose.
/// </summary>
internal sealed class OwnServer : IAsyncDisposable
{
    private readonly string _dir = Path.Combine(
        Path.GetTempPath(),
        "sortrig-lab-pg-" + Guid.NewGuid().ToString("N")[..8]
    );
    private int _port;

    private OwnServer() { }

    /// <summary>The superuser connection string (trust auth, loopback).</summary>
    public string ConnectionString { get; private set; } = "";

    public static async Task<OwnServer> StartAsync()
    {
        var server = new OwnServer();
        try
        {
            await server.StartAgainAsync();
        }
        catch
        {
            await server.DisposeAsync();
            throw;
        }

        return server;
    }

    /// <summary>Fast shutdown: the server ends every session and closes; clients see their connections drop.</summary>
    public async Task StopAsync()
    {
        await RunScriptAsync("stop");

        // The test's own pooled connections to this server are dead now; a later server on the same port must not get
        // them.
        Npgsql.NpgsqlConnection.ClearAllPools();
    }

    /// <summary>Starts the same cluster again on the same port.</summary>
    public async Task StartAgainAsync()
    {
        var url = (await RunScriptAsync("start")).Trim();
        var port = int.Parse(
            url.Split(';').Single(p => p.StartsWith("Port=", StringComparison.Ordinal))[5..],
            System.Globalization.CultureInfo.InvariantCulture
        );
        Assert.True(_port == 0 || _port == port, $"the server came back on port {port}, not {_port}");
        _port = port;
        ConnectionString = url;
    }

    public async ValueTask DisposeAsync()
    {
        try
        {
            await StopAsync();
        }
        finally
        {
            if (Directory.Exists(_dir))
            {
                Directory.Delete(_dir, recursive: true);
            }
        }
    }

    private async Task<string> RunScriptAsync(string verb)
    {
        var start = new ProcessStartInfo("bash")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add(Script());
        start.ArgumentList.Add(verb);
        start.ArgumentList.Add(_dir);
        if (_port != 0)
        {
            start.Environment["SORTRIG_PG_PORT"] = _port.ToString(System.Globalization.CultureInfo.InvariantCulture);
        }

        using var process = Process.Start(start) ?? throw new InvalidOperationException("bash did not start");
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        await process.WaitForExitAsync();
        Assert.True(process.ExitCode == 0, $"pg-test-server {verb}: {await stderr}");
        return await stdout;
    }

    private static string Script()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var script = Path.Combine(dir.FullName, "scripts", "pg-test-server");
            if (File.Exists(script))
            {
                return script;
            }
        }

        throw new FileNotFoundException("scripts/pg-test-server not found above the test assembly");
    }
}
