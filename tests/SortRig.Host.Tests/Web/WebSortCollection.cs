namespace SortRig.Host.Tests.Web;

/// <summary>
/// Tests that run a whole sort verb or a browser take turns: on a 2-core machine, several embedded
/// simulators in scaled time plus Chromium at once starve each other's timers.
/// </summary>
[CollectionDefinition(Name)]
public sealed class WebSortCollection
{
    public const string Name = "web sort runs";
}
