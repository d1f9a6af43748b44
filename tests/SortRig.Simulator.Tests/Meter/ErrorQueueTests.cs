using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Tests.Meter;

public sealed class ErrorQueueTests
{
    [Fact]
    public void Push_MoreThanCapacity_LastEntryBecomesQueueOverflowAndOlderOnesStay()
    {
        var queue = new ErrorQueue();
        for (var i = 0; i < 25; i++)
        {
            queue.Push(new ScpiError(-200 - i, "e"));
        }

        var drained = Enumerable.Range(0, 17).Select(_ => queue.Next().Code).ToArray();

        // SCPI-99 vol. 2 sec. 21.8.4: a full queue (16 entries, our own length) replaces its newest entry with -350.
        Assert.Equal(Enumerable.Range(0, 15).Select(i => -200 - i), drained[..15]);
        Assert.Equal(-350, drained[15]);
        Assert.Equal(0, drained[16]);
    }

    [Fact]
    public void Push_ExactlyCapacity_KeepsAllWithoutOverflow()
    {
        var queue = new ErrorQueue();
        for (var i = 0; i < ErrorQueue.Capacity; i++)
        {
            queue.Push(ScpiError.Syntax);
        }

        Assert.All(Enumerable.Range(0, ErrorQueue.Capacity), _ => Assert.Equal(-102, queue.Next().Code));
        Assert.Equal("0,\"No error\"", queue.Next().Format());
    }
}
