namespace SortRig.Engine.Sorting;

/// <summary>The session as the page and the JSON API show it.</summary>
public sealed record SessionView(
    string Name,
    long SessionId,
    double Nominal,
    double StockTolerance,
    double MatchTolerance,
    string Meter,
    string Range,
    double Nplc,
    int PartsPlanned,
    bool Paused,
    bool Finished
);
