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
        RespectRequiredConstructorParameters = true,
    };

    /// <summary>Throws naming the first figure of <paramref name="prior"/> that no learning could give (a count or
    /// error below zero, a sum that is not finite); on commit and on read.</summary>
    public static void Check(ReelPrior prior)
    {
        Guard.NonNegative(prior.Count, "ReelPrior.Count");
        Guard.NonNegative(prior.Seen, "ReelPrior.Seen");
        Guard.NonNegative(prior.LargestError, "ReelPrior.LargestError");
        Guard.Finite(prior.SumLog, "ReelPrior.SumLog");
        Guard.Finite(prior.SumSquaresLog, "ReelPrior.SumSquaresLog");
    }

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

    /// <summary>The stored prior: null for NULL (no part has carried one yet). False, with the reason, when the text
    /// does not read as a prior (edited by hand, say): what the reel taught is lost, not the batch, so the caller goes
    /// on without it.</summary>
    public static bool TryRead(string? text, out ReelPrior? prior, out string? reason)
    {
        (prior, reason) = (null, null);
        if (text is null)
        {
            return true;
        }

        try
        {
            var s = JsonSerializer.Deserialize<StoredReelPrior>(text, s_options);
            if (s is null)
            {
                reason = "JSON null";
                return false;
            }

            var read = new ReelPrior(s.Count, s.Lowest, s.Highest, s.LargestError, s.Seen, s.SumLog, s.SumSquaresLog);
            Check(read);
            prior = read;
            return true;
        }
        catch (Exception e) when (e is JsonException or ArgumentException or NotSupportedException)
        {
            reason = e.Message;
            return false;
        }
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
