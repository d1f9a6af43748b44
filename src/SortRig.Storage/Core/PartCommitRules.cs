using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Argument checks of a part commit, naming the field and what was expected.</summary>
internal static class PartCommitRules
{
    public static void Check(PartCommit commit)
    {
        ArgumentNullException.ThrowIfNull(commit);
        if (commit.CommitKey == Guid.Empty)
        {
            throw new ArgumentException(
                "CommitKey must be a fresh non-empty GUID per part, kept across retries.",
                nameof(commit)
            );
        }

        Guard.Id(commit.SessionId, nameof(commit.SessionId));
        Guard.Id(commit.BatchId, nameof(commit.BatchId));
        ArgumentNullException.ThrowIfNull(commit.Measured, nameof(commit.Measured));
        Guard.Finite(commit.Measured.Value, "Measured.Value");
        Guard.NonNegative(commit.Measured.StandardUncertainty, "Measured.StandardUncertainty");
        Guard.NonNegative(commit.Measured.TransferUncertainty, "Measured.TransferUncertainty");
        Guard.Positive(commit.Measured.CoverageFactor, "Measured.CoverageFactor");
        Guard.Positive(commit.Range, nameof(commit.Range));
        Guard.Positive(commit.Nplc, nameof(commit.Nplc));
        Guard.FiniteOrNull(commit.Temperature, nameof(commit.Temperature));
        Guard.TextOrNull(commit.CupLabel, nameof(commit.CupLabel));
        Guard.TextOrNull(commit.SlotLabel, nameof(commit.SlotLabel));
        if (commit.State is not (PartState.Accepted or PartState.Unstable))
        {
            throw new ArgumentOutOfRangeException(
                nameof(commit),
                commit.State,
                "State of a new part must be Accepted or Unstable."
            );
        }

        SettleFitRules.Check(commit);
        if (commit.ReelPrior is { } prior)
        {
            ReelPriorText.Check(prior);
        }

        ArgumentNullException.ThrowIfNull(commit.Readings, nameof(commit.Readings));
        for (int i = 0; i < commit.Readings.Count; i++)
        {
            var r = commit.Readings[i];
            if (double.IsNaN(r.Value) || double.IsNaN(r.Range) || r.Range < 0)
            {
                throw new ArgumentException(
                    $"Readings[{i}] must have a value (not NaN) and a range >= 0; got {r.Value} on {r.Range}.",
                    nameof(commit)
                );
            }
        }
    }
}
