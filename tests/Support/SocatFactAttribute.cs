namespace SortRig.Tests.Support;

/// <summary>
/// A fact that needs socat: skipped only when socat is absent and CI is not "true" (in CI it must run, and fails).
/// </summary>
public sealed class SocatFactAttribute : FactAttribute
{
    public SocatFactAttribute()
    {
        Skip = SocatPair.SkipReason();
    }
}
