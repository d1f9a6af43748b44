using System.Data.Common;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>The INSERTs of a part commit: the part row and its raw readings.</summary>
internal abstract partial class AdoPrecisionLog
{
    private async Task<long> InsertPartAsync(DbScope s, PartCommit c, int number, double nominal, CancellationToken ct)
    {
        var m = c.Measured;
        var id = await WithSettle(
                s.Sql(
                        "INSERT INTO parts (commit_key, session_id, batch_id, part_number, nominal_ohms, value_ohms, "
                            + "deviation_ppm, "
                            + "u_standard_ohms, u_transfer_ohms, coverage_k, range_ohms, nplc, temperature_c, "
                            + "accepted_at, cup_label, "
                            + "slot_label, state, announced, library_status, "
                            + SettleInsertColumns
                            + ") VALUES (@key, @session, @batch, @number, "
                            + "@nominal, @value, @deviation, @u, @ut, @k, @range, @nplc, @temp, @at, @cup, @slot, "
                            + "@state, @no, 'Available', "
                            + SettleInsertValues
                            + ") RETURNING id"
                    )
                    .With("key", GuidValue(c.CommitKey))
                    .With("session", c.SessionId)
                    .With("batch", c.BatchId)
                    .With("number", number)
                    .With("nominal", nominal)
                    .With("value", m.Value)
                    .With("deviation", (m.Value - nominal) / nominal * 1e6)
                    .With("u", m.StandardUncertainty)
                    .With("ut", m.TransferUncertainty)
                    .With("k", m.CoverageFactor)
                    .With("range", c.Range)
                    .With("nplc", c.Nplc)
                    .With("temp", c.Temperature)
                    .With("at", TimeValue(c.AcceptedAt))
                    .With("cup", c.CupLabel)
                    .With("slot", c.SlotLabel)
                    .With("state", c.State.ToString())
                    .With("no", false),
                c
            )
            .ScalarLongAsync(ct)
            .ConfigureAwait(false);
        return id!.Value;
    }

    /// <summary>One prepared INSERT reused for every reading of the part, inside the commit's transaction.</summary>
    private async Task InsertReadingsAsync(DbScope s, long partId, PartCommit c, CancellationToken ct)
    {
        if (c.Readings.Count == 0)
        {
            return;
        }

        var q = s.Sql(
                "INSERT INTO raw_readings (part_id, seq, taken_at, value_ohms, range_ohms, kind) VALUES (@p, @q, @t, "
                    + "@v, @r, @k)"
            )
            .With("p", partId)
            .With("q", 0)
            .With("t", TimeValue(c.AcceptedAt))
            .With("v", 0.0)
            .With("r", 0.0)
            .With("k", "Finite");
        await using (q.Command.ConfigureAwait(false))
        {
            DbParameterCollection ps = q.Command.Parameters;
            for (int i = 0; i < c.Readings.Count; i++)
            {
                var reading = c.Readings[i];
                ps[1].Value = i;
                ps[2].Value = TimeValue(reading.Time);
                ps[3].Value = reading.Value;
                ps[4].Value = reading.Range;
                ps[5].Value = reading.Kind.ToString();
                await q.Command.ExecuteNonQueryAsync(ct).ConfigureAwait(false);
            }
        }
    }
}
