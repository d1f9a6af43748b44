using SortRig.Engine.Announcing;
using SortRig.Engine.Durability;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    private static readonly TimeSpan s_storageRetry = TimeSpan.FromSeconds(2);

    // A storage fault an operator can clear (StorageFaultRule: read-only, locked, disk full, unreachable) pauses
    // the loop: nothing else is measured or announced, the operator is told once in plain words, and the same
    // idempotent write is retried until it goes through. Every write the loop makes goes through here.
    private async Task<T> DurablyAsync<T>(string what, Func<CancellationToken, Task<T>> write, CancellationToken ct)
    {
        var told = false;
        while (true)
        {
            try
            {
                var result = await write(ct).ConfigureAwait(false);
                if (told)
                {
                    _ctx.Snapshot.UpdateSession(s => s with { Paused = _paused });
                    await _ctx
                        .Announcer.AnnounceAsync(Announcement.Info($"storage is back: {what} saved, carrying on"), ct)
                        .ConfigureAwait(false);
                }

                return result;
            }
            catch (StorageException e) when (!ct.IsCancellationRequested && StorageFaultRule.OperatorCanClear(e.Fault))
            {
                _storageFaults++;
                Log.SortStorageFault(_ctx.Logger, e.Operation, e.Fault.ToString(), e.Message);
                if (!told)
                {
                    told = true;
                    _ctx.Snapshot.UpdateSession(s => s with { Paused = true });
                    await _ctx
                        .Announcer.AnnounceAsync(
                            Announcement.Info(
                                $"storage fault, {StorageFaultRule.Plain(e.Fault)}: paused, nothing lost; {what} is "
                                    + $"not saved yet and the part stays in the fixture. Retrying every "
                                    + $"{s_storageRetry.TotalSeconds:0} s. {e.Message}"
                            ),
                            ct
                        )
                        .ConfigureAwait(false);
                }

                await Task.Delay(s_storageRetry, _ctx.Time, ct).ConfigureAwait(false);
            }
        }
    }
}
