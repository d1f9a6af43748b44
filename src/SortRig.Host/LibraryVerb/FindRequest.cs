using System.Globalization;
using SortRig.Engine.Picking;
using SortRig.Host.VerbSupport;
using SortRig.Measurement.Readings;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.LibraryVerb;

/// <summary>A library search.</summary>
/// <param name="Database">SQLite path or PostgreSQL connection string.</param>
/// <param name="Nominal">Nominal, e.g. "10000", "10k", "4.99k"; null for any.</param>
/// <param name="MinPpm">Lowest deviation, ppm, inclusive; null for no bound.</param>
/// <param name="MaxPpm">Highest deviation, ppm, inclusive; null for no bound.</param>
/// <param name="Status">available (default), taken, used, retired or any.</param>
/// <param name="Location">Exact storage location; null for any.</param>
/// <param name="Limit">At most this many parts, 1..100 000.</param>
internal sealed record FindRequest(
    string Database,
    string? Nominal,
    double? MinPpm,
    double? MaxPpm,
    string Status = "available",
    string? Location = null,
    int Limit = 1000
);
