namespace SortRig.Host.Web;

/// <summary>Settings of the bench page, bound from the "Web" configuration section.</summary>
internal sealed class WebOptions
{
    /// <summary>Configuration section name.</summary>
    public const string Section = "Web";

    /// <summary>Serve the page. Default false for the CLI verbs, which turn it on with --web.</summary>
    public bool Enabled { get; set; }

    /// <summary>Listen URLs, ';' separated. Default http://127.0.0.1:5080 (loopback only).</summary>
    public string Urls { get; set; } = "http://127.0.0.1:5080";

    /// <summary>
    /// Access token. Required when any URL binds an address other than loopback; when set, every
    /// request must carry it (Authorization: Bearer, or ?token= once, which sets a cookie). Never logged.
    /// </summary>
    public string Token { get; set; } = "";
}
