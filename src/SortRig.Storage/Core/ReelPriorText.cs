using System.Text.Json;
using System.Text.Json.Serialization;
using SortRig.Measurement.Settling;

namespace SortRig.Storage.Core;

/// <summary>
/// A batch's reel prior as stored (schema version 7, <c>batches.reel_prior</c>): JSON text of its seven figures, the
/// empty prior's infinite range as the named literals "Infinity" and "-Infinity".
/// </summary>
internal static class ReelPriorText
{
    private static readonly JsonSerializerOptions s_options = new()
    {
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
    };

    public static string Write(ReelPrior prior) =>
        JsonSerializer.Serialize(
            new StoredReelPrior(
                prior.Count,
                prior.Lowest,
                prior.Highest,
                prior.LargestError,
                prior.Seen,
                prior.SumLog,
                prior.SumSquaresLog
            ),
            s_options
        );

    /// <summary>The stored prior; null for NULL (no part has carried one yet).</summary>
    public static ReelPrior? Read(string? text)
    {
        if (text is null)
        {
            return null;
        }

        var s = JsonSerializer.Deserialize<StoredReelPrior>(text, s_options)
            ?? throw new InvalidDataException("batches.reel_prior holds JSON null.");
        return new ReelPrior(s.Count, s.Lowest, s.Highest, s.LargestError, s.Seen, s.SumLog, s.SumSquaresLog);
    }
}

/// <summary>The stored figures of a <see cref="ReelPrior"/>, by name.</summary>
internal sealed record StoredReelPrior(
    int Count,
    double Lowest,
    double Highest,
    double LargestError,
    int Seen,
    double SumLog,
    double SumSquaresLog
);
