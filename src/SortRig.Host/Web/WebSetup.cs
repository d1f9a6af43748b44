using Microsoft.AspNetCore.Builder;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;

namespace SortRig.Host.Web;

/// <summary>Wires the bench page into a web application.</summary>
internal static class WebSetup
{
    /// <summary>Reads and checks the Web section; throws before anything listens when the bind is unsafe.</summary>
    public static WebOptions Configure(WebApplicationBuilder builder)
    {
        var options = builder.Configuration.GetSection(WebOptions.Section).Get<WebOptions>() ?? new WebOptions();
        WebBindGuard.Check(options);
        builder.WebHost.UseUrls(options.Urls.Split(';', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries));
        builder.Services.AddSingleton(options);
        return options;
    }

    public static void Use(WebApplication app, WebOptions options)
    {
        if (!string.IsNullOrEmpty(options.Token))
        {
            app.UseMiddleware<TokenGate>(options.Token);
        }

        WebEndpoints.Map(app);
    }
}
