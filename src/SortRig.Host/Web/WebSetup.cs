using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Logging;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Host.Operator;

namespace SortRig.Host.Web;

/// <summary>Wires the bench page into a web application.</summary>
internal static class WebSetup
{
    // Logs every request line with its query string, where ?token= travels.
    private const string RequestLineLogger = "Microsoft.AspNetCore.Hosting.Diagnostics";

    /// <summary>Reads and checks the Web section; throws before anything listens when the bind is unsafe.</summary>
    public static WebOptions Configure(WebApplicationBuilder builder)
    {
        var options = builder.Configuration.GetSection(WebOptions.Section).Get<WebOptions>() ?? new WebOptions();
        WebBindGuard.Check(options);
        if (options.Token.Length > 0)
        {
            // The token is never logged, whatever levels the configuration asks for: the request
            // line logger is held at Warning (added last, so it overrides appsettings and flags).
            builder.Configuration.AddInMemoryCollection([
                new($"Serilog:MinimumLevel:Override:{RequestLineLogger}", "Warning"),
            ]);
            builder.Logging.AddFilter(RequestLineLogger, LogLevel.Warning);
        }

        builder.WebHost.UseUrls([.. WebBindGuard.Urls(options)]);
        builder.Services.AddSingleton(options);

        // What the page reads; a verb that registered its own (the sort verb does) keeps them.
        // A verb that publishes to the page (drift logging) resolves the same BenchEventHub.
        builder.Services.TryAddSingleton(TimeProvider.System);
        builder.Services.TryAddSingleton<BenchEventHub>();
        builder.Services.TryAddSingleton<BenchSnapshot>();
        builder.Services.TryAddSingleton<OperatorCommands>();
        return options;
    }

    public static void Use(WebApplication app, WebOptions options)
    {
        var loopbackOnly = WebBindGuard.Urls(options).All(WebBindGuard.IsLoopback);
        app.UseMiddleware<BrowserGuard>(loopbackOnly && options.Token.Length == 0);
        if (options.Token.Length > 0)
        {
            app.UseMiddleware<TokenGate>(options.Token);
        }

        WebEndpoints.Map(app);
    }
}
