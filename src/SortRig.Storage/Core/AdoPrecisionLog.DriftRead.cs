using System.Data.Common;
using System.Runtime.CompilerServices;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Streaming read of drift samples: one open reader, one row at a time.</summary>
internal abstract partial class AdoPrecisionLog
{
    public async IAsyncEnumerable<StoredDriftSample> ReadDriftSamplesAsync(
        long runId,
        [EnumeratorCancellation] CancellationToken cancellationToken
    )
    {
        const string operation = "read drift samples";
        _ = await GetDriftRunAsync(runId, cancellationToken).ConfigureAwait(false)
            ?? throw NotFound(operation, $"Drift run {runId}");
        var connection = await Guarded(
                operation,
                () => OpenConnectionAsync(cancellationToken).AsTask(),
                cancellationToken
            )
            .ConfigureAwait(false);
        await using (connection.ConfigureAwait(false))
        {
            var query = new DbScope(connection, null)
                .Sql(
                    "SELECT run_id, channel, taken_at, ohms, temperature_c FROM drift_samples WHERE run_id = @run "
                        + "ORDER BY taken_at, channel"
                )
                .With("run", runId);
            await using (query.Command.ConfigureAwait(false))
            {
                var reader = await Guarded(
                        operation,
                        () => query.Command.ExecuteReaderAsync(cancellationToken),
                        cancellationToken
                    )
                    .ConfigureAwait(false);
                await using (reader.ConfigureAwait(false))
                {
                    while (
                        await Guarded(operation, () => reader.ReadAsync(cancellationToken), cancellationToken)
                            .ConfigureAwait(false)
                    )
                    {
                        yield return ReadDriftSample(reader);
                    }
                }
            }
        }
    }

    private async Task<T> Guarded<T>(string operation, Func<Task<T>> step, CancellationToken cancellationToken)
    {
        try
        {
            return await step().ConfigureAwait(false);
        }
        catch (DbException e) when (!cancellationToken.IsCancellationRequested)
        {
            throw Fail(operation, Classify(e, out _), e);
        }
    }
}
