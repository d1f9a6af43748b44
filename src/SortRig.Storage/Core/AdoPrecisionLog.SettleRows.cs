using System.Data.Common;
using SortRig.Measurement.Settling;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>
/// The settle record of a part (schema version 3): which rule accepted it and the predictive rule's fit, one numeric
/// column per figure so the log can be queried without parsing.
/// </summary>
internal abstract partial class AdoPrecisionLog
{
    /// <summary>Appended to the part columns; ordinals from <see cref="SettleOrdinal"/>.</summary>
    private protected const string SettleColumns =
        "p.accepted_by, p.fit_model, p.fit_value_ohms, p.fit_u_fit_ohms, p.fit_u_misfit_ohms, p.fit_tau1_s, "
        + "p.fit_tau2_s, "
        + "p.fit_readings, p.fit_span_s, p.fit_rms_ohms, p.fit_runs_z, p.fit_weight";

    private const string SettleInsertColumns =
        "accepted_by, fit_model, fit_value_ohms, fit_u_fit_ohms, fit_u_misfit_ohms, fit_tau1_s, fit_tau2_s, "
        + "fit_readings, "
        + "fit_span_s, fit_rms_ohms, fit_runs_z, fit_weight";

    private const string SettleInsertValues = "@by, @fm, @fv, @fu, @fmu, @ft1, @ft2, @fn, @fs, @frms, @fz, @fw";

    /// <summary>Ordinal of accepted_by in a row read with the part columns.</summary>
    private const int SettleOrdinal = 21;

    private static Query WithSettle(Query q, PartCommit c)
    {
        var f = c.Fit;
        var taus = f?.TimeConstantsSeconds;
        return q.With("by", c.AcceptedBy?.ToString())
            .With("fm", f?.Model.ToString())
            .With("fv", f?.FinalValue)
            .With("fu", f?.FitUncertainty)
            .With("fmu", f?.MisfitUncertainty)
            .With("ft1", taus is { Count: > 0 } ? taus[0] : null)
            .With("ft2", taus is { Count: > 1 } ? taus[1] : null)
            .With("fn", f?.Readings)
            .With("fs", f?.SpanSeconds)
            .With("frms", f?.ResidualRms)
            // SQLite stores NaN as NULL; store it so on both engines and read it back as NaN.
            .With("fz", f is null || !double.IsFinite(f.RunsZ) ? null : f.RunsZ)
            .With("fw", f?.Weight);
    }

    private static (SettleRule? AcceptedBy, RecoveryFit? Fit) ReadSettle(DbDataReader r)
    {
        int o = SettleOrdinal;
        SettleRule? by = r.IsDBNull(o) ? null : Enum.Parse<SettleRule>(r.GetString(o));
        if (r.IsDBNull(o + 1))
        {
            return (by, null);
        }

        var model = Enum.Parse<RecoveryModel>(r.GetString(o + 1));
        double[] taus = r.IsDBNull(o + 6) ? [r.GetDouble(o + 5)] : [r.GetDouble(o + 5), r.GetDouble(o + 6)];
        var fit = new RecoveryFit(
            model,
            r.GetDouble(o + 2),
            r.GetDouble(o + 3),
            r.GetDouble(o + 4),
            taus,
            (int)ReadLong(r, o + 7),
            r.GetDouble(o + 8),
            r.GetDouble(o + 9),
            ReadDouble(r, o + 10) ?? double.NaN,
            r.GetDouble(o + 11)
        );
        return (by, fit);
    }
}
