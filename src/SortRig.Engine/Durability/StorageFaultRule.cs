using SortRig.Storage.Contracts;

namespace SortRig.Engine.Durability;

/// <summary>
/// The one durable-write rule of the engine, shared by sorting and drift logging. Every write is idempotent, so a
/// retry after an unknown outcome is safe. Read-only and full disks need a person: the sorting session (an operator
/// stands at the bench, the part waits in the fixture) pauses and retries until they are cleared; the drift logger
/// (unattended overnight) stops with the fault, and what it stored before is complete up to the fault. Locked and
/// unreachable stores clear by themselves: sorting retries them until they do, drift retries them a bounded number
/// of times with back-off. Pure.
/// </summary>
internal static class StorageFaultRule
{
    /// <summary>The action for a fault.</summary>
    public static StorageFaultAction For(StorageFault fault) =>
        fault switch
        {
            StorageFault.Locked or StorageFault.Unavailable => StorageFaultAction.Retry,
            StorageFault.ReadOnly or StorageFault.DiskFull or StorageFault.Other => StorageFaultAction.AskOperator,
            _ => StorageFaultAction.Stop,
        };

    /// <summary>True when an operator at the bench can wait it out: every fault but <see
    /// cref="StorageFaultAction.Stop"/>.</summary>
    public static bool OperatorCanClear(StorageFault fault) => For(fault) != StorageFaultAction.Stop;

    /// <summary>True when an unattended job should retry: only faults that clear by themselves.</summary>
    public static bool ClearsByItself(StorageFault fault) => For(fault) == StorageFaultAction.Retry;

    /// <summary>The fault in plain words for the operator.</summary>
    public static string Plain(StorageFault fault) =>
        fault switch
        {
            StorageFault.ReadOnly => "the database cannot be written (read-only)",
            StorageFault.Locked => "the database is locked by another program",
            StorageFault.DiskFull => "the disk is full",
            StorageFault.Unavailable => "the database cannot be reached",
            _ => "the database could not write",
        };
}
