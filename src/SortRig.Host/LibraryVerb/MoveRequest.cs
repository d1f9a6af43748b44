using SortRig.Host.VerbSupport;
using SortRig.Measurement.Readings;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.LibraryVerb;

/// <summary>A take, release, used or retire request.</summary>
/// <param name="Database">SQLite path or PostgreSQL connection string.</param>
/// <param name="Move">The change.</param>
/// <param name="Ids">Part ids; all change or none.</param>
/// <param name="Note">Take: who takes (required). Use: the build (optional). Retire: the reason (required).</param>
internal sealed record MoveRequest(string Database, LibraryMove Move, IReadOnlyList<long> Ids, string? Note);
