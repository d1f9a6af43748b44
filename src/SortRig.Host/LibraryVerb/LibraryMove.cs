using SortRig.Host.VerbSupport;
using SortRig.Measurement.Readings;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.LibraryVerb;

/// <summary>A library status change the verbs offer.</summary>
internal enum LibraryMove
{
    /// <summary>Available to Taken (by someone).</summary>
    Take,

    /// <summary>Taken back to Available.</summary>
    Release,

    /// <summary>Taken to Used (fitted into a build).</summary>
    Use,

    /// <summary>Anything but Retired to Retired.</summary>
    Retire,
}
