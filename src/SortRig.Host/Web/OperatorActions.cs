using SortRig.Engine.Operator;
using SortRig.Host.Operator;

namespace SortRig.Host.Web;

/// <summary>
/// The only thing the page can ask for: one of five operator actions, by fixed name. Whatever else
/// a request carries is never passed on, and nothing from a request ever reaches the meter.
/// </summary>
internal static class OperatorActions
{
    /// <summary>Action names accepted by POST /api/actions/{action}, in the order the page shows them.</summary>
    public static IReadOnlyList<string> Names { get; } = ["undo", "remeasure", "pause", "finish", "remeasure-flagged"];

    /// <summary>The operator command for an action name (exact, lower case), or null when unknown.</summary>
    public static OperatorCommand? Parse(string action) =>
        action switch
        {
            "undo" => OperatorCommand.UndoLast,
            "remeasure" => OperatorCommand.Remeasure,
            "pause" => OperatorCommand.TogglePause,
            "finish" => OperatorCommand.Finish,
            "remeasure-flagged" => OperatorCommand.RemeasureFlagged,
            _ => null,
        };
}
