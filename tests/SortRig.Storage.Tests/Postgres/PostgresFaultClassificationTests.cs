using Npgsql;
using SortRig.Storage.Contracts;
using SortRig.Storage.Postgres;

namespace SortRig.Storage.Tests.Postgres;

/// <summary>
/// How a failure of the link to PostgreSQL is classified: Unavailable (the drift logger and the sort wait it out)
/// also when Npgsql wraps it, as it does when a connection is used again after it broke ("The connection was
/// previously broken because of the following exception", around "Exception while reading from stream", around the
/// timeout). Seen in a lab outage run: classified Other, the drift run stopped instead of waiting. The wrapping is
/// Npgsql's (its message texts, taken from that run); no server needed.
/// </summary>
public sealed class PostgresFaultClassificationTests
{
    [Fact]
    public void LinkTimeout_WrappedTwice_IsUnavailable()
    {
        var broken = new NpgsqlException(
            "The connection was previously broken because of the following exception",
            new NpgsqlException("Exception while reading from stream", new TimeoutException("Timeout during reading"))
        );

        Assert.Equal(StorageFault.Unavailable, PostgresPrecisionLog.ClassifyCore(broken, out _));
    }

    [Fact]
    public void WrappedFailureThatIsNotTheLink_StaysOther()
    {
        var other = new NpgsqlException("outer", new NpgsqlException("inner", new InvalidOperationException("x")));

        Assert.Equal(StorageFault.Other, PostgresPrecisionLog.ClassifyCore(other, out _));
    }
}
