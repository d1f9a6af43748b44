using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Host.Web;

namespace SortRig.Host.Tests.Web;

/// <summary>
/// The page's web application alone, wired by <see cref="WebSetup"/> exactly as the sort verb wires
/// it, on Kestrel at a free loopback port, with the queue of operator actions in the test's hands.
/// </summary>
internal sealed class WebHarness : IAsyncDisposable
{
    private WebHarness(WebApplication app, BenchEventHub hub, OperatorCommands commands)
    {
        App = app;
        Hub = hub;
        Commands = commands;
        BaseUrl = app.Urls.Single();
        Http = new HttpClient { BaseAddress = new Uri(BaseUrl), Timeout = TimeSpan.FromSeconds(10) };
    }

    public WebApplication App { get; }

    public BenchEventHub Hub { get; }

    public OperatorCommands Commands { get; }

    public string BaseUrl { get; }

    public HttpClient Http { get; }

    public static async Task<WebHarness> StartAsync(
        string? token = null,
        TimeProvider? time = null,
        SortRig.Engine.Typed.TypedEntries? typed = null
    )
    {
        time ??= TimeProvider.System;
        var builder = WebApplication.CreateBuilder(
            new WebApplicationOptions { Args = [], ContentRootPath = AppContext.BaseDirectory }
        );
        builder.Logging.ClearProviders();
        builder.Configuration.AddInMemoryCollection(
            new Dictionary<string, string?> { ["Web:Urls"] = "http://127.0.0.1:0", ["Web:Token"] = token ?? "" }
        );
        var hub = new BenchEventHub(time);
        var commands = new OperatorCommands();
        builder.Services.AddSingleton(time);
        builder.Services.AddSingleton(hub);
        builder.Services.AddSingleton(new BenchSnapshot());
        builder.Services.AddSingleton(commands);
        if (typed is not null)
        {
            builder.Services.AddSingleton(typed);
        }

        var options = WebSetup.Configure(builder);
        var app = builder.Build();
        WebSetup.Use(app, options);
        await app.StartAsync();
        return new WebHarness(app, hub, commands);
    }

    /// <summary>Every operator action waiting in the queue, taken out.</summary>
    public List<OperatorCommand> Queued()
    {
        var taken = new List<OperatorCommand>();
        while (Commands.TryTake(out var c))
        {
            taken.Add(c);
        }

        return taken;
    }

    public async ValueTask DisposeAsync()
    {
        Http.Dispose();
        await App.StopAsync();
        await App.DisposeAsync();
    }
}
