using System.Globalization;
using SortRig.Host.LibraryVerb;
using SortRig.Storage.Contracts;

namespace SortRig.Host.VerbSupport;

/// <summary>Parses a library status option: available, taken, used, retired or any (null).</summary>
internal static class StatusArg
{
    public static LibraryStatus? Parse(string? text) =>
        (text ?? "available").Trim().ToLowerInvariant() switch
        {
            "available" => LibraryStatus.Available,
            "taken" => LibraryStatus.Taken,
            "used" => LibraryStatus.Used,
            "retired" => LibraryStatus.Retired,
            "any" or "all" => null,
            _ => throw new VerbException($"--status: '{text}' is not one of available, taken, used, retired, any"),
        };
}
