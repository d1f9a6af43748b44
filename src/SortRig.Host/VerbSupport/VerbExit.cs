using SortRig.Host.LibraryVerb;
using SortRig.Planning.Recipes;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.VerbSupport;

/// <summary>Exit codes of the plan and library verbs.</summary>
internal static class VerbExit
{
    /// <summary>Done.</summary>
    public const int Ok = 0;

    /// <summary>The library refused an all-or-none change; nothing was changed and the ids are named.</summary>
    public const int Refused = 1;

    /// <summary>Bad input: unknown ids or session, bad option, unreadable recipe, database or output file.</summary>
    public const int BadInput = 2;
}
