using System.Text.Json;
using SortRig.Host.Cli;
using SortRig.Storage;
using SortRig.Storage.Contracts;

namespace SortRig.Host.Tests.Web;

/// <summary>
/// The sort verb with the page on, run in-process exactly as the command line runs it
/// (<see cref="SortCommand.RunAsync"/> with configuration keys as flags): the embedded simulator
/// on a real TCP socket, a real SQLite file, Kestrel on a free port, Serilog to a file.
/// </summary>
internal sealed class WebSortRun : IAsyncDisposable
{
    private readonly CancellationTokenSource _stop = new();
    private Task<int>? _run;

    private WebSortRun(string directory, int port) => (Directory, Port) = (directory, port);

    public string Directory { get; }

    public int Port { get; }

    /// <summary>The page's address, always on loopback (a 0.0.0.0 bind answers there too).</summary>
    public string BaseUrl => $"http://127.0.0.1:{Port}";

    public string Database => Path.Combine(Directory, "web.db");

    public string LogDirectory => Path.Combine(Directory, "logs");

    /// <summary>Session name, unique to the run, so the test knows the page that answers is this run's.</summary>
    public string Session { get; } = "web-" + Guid.NewGuid().ToString("N")[..8];

    /// <summary>Starts the sort verb and waits until its page answers with its session.</summary>
    public static async Task<WebSortRun> StartAsync(
        int parts,
        double speed,
        string? token = null,
        bool anyAddress = false,
        IReadOnlyDictionary<string, string?>? extra = null
    )
    {
        var run = new WebSortRun(
            System.IO.Directory.CreateTempSubdirectory("sortrig-web-").FullName,
            TestPorts.Free(anyAddress)
        );
        var flags = run.Flags(parts, speed, anyAddress ? $"http://0.0.0.0:{run.Port}" : run.BaseUrl, token);
        foreach (var (key, value) in extra ?? new Dictionary<string, string?>())
        {
            flags[key] = value;
        }

        run._run = Task.Run(() => SortCommand.RunAsync(flags, run._stop.Token));
        using var http = new HttpClient { Timeout = TimeSpan.FromSeconds(2) };
        if (token is not null)
        {
            http.DefaultRequestHeaders.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue(
                "Bearer",
                token
            );
        }

        var deadline = DateTimeOffset.UtcNow.AddSeconds(30);
        while (true)
        {
            if (run._run.IsCompleted)
            {
                var exit = await run._run;
                throw new InvalidOperationException(
                    $"the sort verb ended before the page answered (exit {exit}); its log:\n{run.LogText()}"
                );
            }

            Assert.True(DateTimeOffset.UtcNow < deadline, "the page did not answer with its session within 30 s");
            try
            {
                using var answer = await http.GetAsync(run.BaseUrl + "/api/session");
                if (
                    answer.IsSuccessStatusCode
                    && JsonDocument
                        .Parse(await answer.Content.ReadAsStringAsync())
                        .RootElement.GetProperty("name")
                        .GetString() == run.Session
                )
                {
                    return run;
                }
            }
            catch (HttpRequestException)
            {
                // Not listening yet.
            }

            await Task.Delay(100);
        }
    }

    /// <summary>Flags as SortCommand receives them from the command line (--plain and --no-speech are
    /// "True").</summary>
    public Dictionary<string, string?> Flags(int parts, double speed, string urls, string? token)
    {
        var flags = new Dictionary<string, string?>
        {
            ["Sort:Database"] = Database,
            ["Sort:Session"] = Session,
            ["Sort:Parts"] = parts.ToString(System.Globalization.CultureInfo.InvariantCulture),
            ["Sort:Speed"] = speed.ToString(System.Globalization.CultureInfo.InvariantCulture),
            ["Sort:Live"] = "True",
            ["Sort:Speech"] = "True",
            ["Sort:StayAfterFinish"] = "true",
            ["Web:Enabled"] = "true",
            ["Web:Urls"] = urls,
            ["Logging:File"] = Path.Combine(LogDirectory, "sortrig-.log"),
        };
        if (token is not null)
        {
            flags["Web:Token"] = token;
        }

        return flags;
    }

    /// <summary>Polls /api/session until the session reports finished; returns its JSON.</summary>
    public async Task<JsonElement> WaitFinishedAsync(HttpClient http, TimeSpan timeout)
    {
        var deadline = DateTimeOffset.UtcNow + timeout;
        while (true)
        {
            using var answer = await http.GetAsync(BaseUrl + "/api/session");
            if (answer.IsSuccessStatusCode)
            {
                var session = JsonDocument.Parse(await answer.Content.ReadAsStringAsync()).RootElement.Clone();
                if (session.GetProperty("finished").GetBoolean())
                {
                    return session;
                }
            }

            if (DateTimeOffset.UtcNow > deadline)
            {
                Assert.Fail($"the session did not finish within {timeout}; its log:\n{LogText()}");
            }

            await Task.Delay(100);
        }
    }

    /// <summary>Stops the verb (Ctrl+C) and waits for it; fails if it does not stop promptly.</summary>
    public async Task<int> StopAsync()
    {
        await _stop.CancelAsync();
        return await _run!.WaitAsync(TimeSpan.FromSeconds(20));
    }

    /// <summary>The parts of the session as the precision log stores them (read after <see
    /// cref="StopAsync"/>).</summary>
    public async Task<IReadOnlyList<PartRecord>> StoredPartsAsync(long sessionId)
    {
        await using var log = await PrecisionLogFactory.OpenAsync(Database, null, default);
        return await log.GetPartsAsync(sessionId, default);
    }

    /// <summary>All text Serilog wrote to its files.</summary>
    public string LogText() =>
        System.IO.Directory.Exists(LogDirectory)
            ? string.Concat(System.IO.Directory.GetFiles(LogDirectory).Order().Select(File.ReadAllText))
            : "";

    public async ValueTask DisposeAsync()
    {
        if (_run is { IsCompleted: false })
        {
            await _stop.CancelAsync();
            await _run.WaitAsync(TimeSpan.FromSeconds(20)).ContinueWith(_ => { }, TaskScheduler.Default);
        }

        _stop.Dispose();
        try
        {
            System.IO.Directory.Delete(Directory, recursive: true);
        }
        catch (IOException)
        {
            // A file still held open; the temp folder is cleaned by the system.
        }
    }
}
