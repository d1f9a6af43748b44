namespace SortRig.Tests.Support;

/// <summary>The one deadline helper of the test projects: waits in real time for work finishing elsewhere.</summary>
internal static class Eventually
{
    /// <summary>Polls <paramref name="condition"/> every millisecond or so until it holds; fails the test, naming
    /// <paramref name="what"/>, after <paramref name="limit"/> of real time.</summary>
    public static async Task HoldsAsync(Func<bool> condition, TimeSpan limit, string what)
    {
        var deadline = DateTimeOffset.UtcNow + limit;
        while (!condition())
        {
            Assert.True(
                DateTimeOffset.UtcNow < deadline,
                $"timed out after {limit.TotalSeconds:0.#} s waiting for {what}"
            );
            await Task.Delay(1);
        }
    }
}
