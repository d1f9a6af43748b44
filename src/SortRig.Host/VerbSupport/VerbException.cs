using SortRig.Host.LibraryVerb;
using SortRig.Planning.Recipes;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.VerbSupport;

/// <summary>Bad input a verb detected itself (unknown session or ids, malformed option); the message says what and
/// where.</summary>
internal sealed class VerbException(string message) : Exception(message);
