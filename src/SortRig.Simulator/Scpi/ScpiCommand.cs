namespace SortRig.Simulator.Scpi;

/// <summary>Handles one command or query; returns the reply body for a query, null for a command.</summary>
internal delegate ValueTask<string?> ScpiHandler(ScpiCall call, CancellationToken ct);

/// <summary>One entry of the command tree: a header in command or query form and its parameter count.</summary>
internal sealed record ScpiCommand(
    HeaderPattern Header,
    bool IsQuery,
    int MinParameters,
    int MaxParameters,
    ScpiHandler Handler
);
