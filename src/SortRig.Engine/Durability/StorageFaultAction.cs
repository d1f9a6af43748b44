using SortRig.Storage.Contracts;

namespace SortRig.Engine.Durability;

/// <summary>What a job does about a write to the precision log that failed (<see cref="StorageFaultRule"/>).</summary>
internal enum StorageFaultAction
{
    /// <summary>Clears by itself (another program holds the lock, the server is briefly unreachable): retry with
    /// back-off.</summary>
    Retry,

    /// <summary>
    /// A person must act (the disk is full, the file or its folder became read-only, the write failed for another
    /// reason the store could not name): with an operator at the bench, pause, tell them once and retry until the
    /// write goes through; an unattended job stops with the fault.
    /// </summary>
    AskOperator,

    /// <summary>A corrupt store, a constraint or a conflict: a bug or a misuse that retrying cannot cure;
    /// stop.</summary>
    Stop,
}
