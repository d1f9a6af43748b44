using Microsoft.Extensions.Time.Testing;
using SortRig.Tests.Support;

namespace SortRig.Simulator.Tests.Support;

/// <summary>Drives a task that waits on a FakeTimeProvider to completion by advancing virtual time.</summary>
internal static class VirtualTime
{
    public static async Task<T> RunAsync<T>(
        FakeTimeProvider clock,
        Task<T> task,
        TimeSpan step,
        int maxSteps = 2_000_000
    )
    {
        for (var i = 0; !task.IsCompleted; i++)
        {
            if (i >= maxSteps)
            {
                throw new TimeoutException($"Task did not complete within {maxSteps} steps of {step}.");
            }

            clock.Advance(step);
            if (!task.IsCompleted)
            {
                await Task.Yield();
            }
        }

        return await task;
    }

    /// <summary>Polls a condition in real time (for work finishing on the thread pool), at most 10 s.</summary>
    public static Task EventuallyAsync(Func<bool> condition, string what) =>
        Eventually.HoldsAsync(condition, TimeSpan.FromSeconds(10), what);
}
