using SortRig.Measurement.Settling;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Argument checks of a part commit's settle record: which rule accepted it, and the predictive fit.</summary>
internal static class SettleFitRules
{
    public static void Check(PartCommit commit)
    {
        if (commit.AcceptedBy is { } rule && !Enum.IsDefined(rule))
        {
            throw new ArgumentOutOfRangeException(nameof(commit), rule, "AcceptedBy must be Averaging or Predictive.");
        }

        if (commit.AcceptedBy is not null && commit.State != PartState.Accepted)
        {
            throw new ArgumentException("AcceptedBy is set only for an accepted part.", nameof(commit));
        }

        if (commit.Fit is not { } fit)
        {
            return;
        }

        if (commit.AcceptedBy != SettleRule.Predictive)
        {
            throw new ArgumentException("Fit is stored only for a part the predictive rule accepted.", nameof(commit));
        }

        if (!Enum.IsDefined(fit.Model))
        {
            throw new ArgumentOutOfRangeException(
                nameof(commit),
                fit.Model,
                "Fit.Model must be OneExponential or TwoExponentials."
            );
        }

        Guard.Finite(fit.FinalValue, "Fit.FinalValue");
        Guard.NonNegative(fit.FitUncertainty, "Fit.FitUncertainty");
        Guard.NonNegative(fit.MisfitUncertainty, "Fit.MisfitUncertainty");
        Guard.NonNegative(fit.SpanSeconds, "Fit.SpanSeconds");
        Guard.NonNegative(fit.ResidualRms, "Fit.ResidualRms");
        Guard.NonNegative(fit.Weight, "Fit.Weight");
        ArgumentNullException.ThrowIfNull(fit.TimeConstantsSeconds, "Fit.TimeConstantsSeconds");
        if (fit.TimeConstantsSeconds.Count != (int)fit.Model)
        {
            throw new ArgumentException(
                $"Fit.TimeConstantsSeconds must hold {(int)fit.Model} time constant(s) for {fit.Model}; got "
                    + $"{fit.TimeConstantsSeconds.Count}.",
                nameof(commit)
            );
        }

        foreach (var tau in fit.TimeConstantsSeconds)
        {
            Guard.Positive(tau, "Fit.TimeConstantsSeconds");
        }

        if (fit.Readings < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(commit), fit.Readings, "Fit.Readings must be >= 0.");
        }
    }
}
