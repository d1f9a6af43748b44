using Microsoft.Extensions.Logging;

namespace SortRig.Planning;

/// <summary>Source-generated log messages of the planning layer. Event ids 4000-4999.</summary>
internal static partial class Log
{
    [LoggerMessage(
        EventId = 4001,
        Level = LogLevel.Information,
        Message = "Assembled {Sets} sets of recipe {Recipe} from {Parts} parts by {Method} (optimal proven: {Proven})"
    )]
    public static partial void Assembled(
        ILogger logger,
        int sets,
        string recipe,
        int parts,
        string method,
        bool proven
    );

    [LoggerMessage(
        EventId = 4002,
        Level = LogLevel.Information,
        Message = "Exact search for recipe {Recipe} exceeded its limits with {Parts} parts; using the sweep"
    )]
    public static partial void ExactFallback(ILogger logger, string recipe, int parts);

    [LoggerMessage(
        EventId = 4003,
        Level = LogLevel.Debug,
        Message = "Cup bands planned for nominal {Nominal} ohms from {Samples} parts: {Bands}"
    )]
    public static partial void BandsPlanned(ILogger logger, double nominal, int samples, string bands);
}
