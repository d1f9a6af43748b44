using System.IO.Ports;
using SortRig.Simulator.Faults;
using SortRig.Simulator.Tests.Support;
using SortRig.Tests.Support;

namespace SortRig.Simulator.Tests.Serving;

/// <summary>The bench on one end of a real socat pseudo-terminal pair, a SerialPort client on the other.</summary>
public sealed class SerialServerTests
{
    [SocatFact]
    public async Task Idn_OverSerial_RepliesOneLine()
    {
        await using var pair = await SocatPair.StartAsync();
        await using var bench = new SimulatedBench(Benches.Manual(), new ScaledTimeProvider(1000));
        await bench.StartSerialAsync(pair.EndA);
        using var port = Open(pair.EndB);

        Assert.Equal(bench.Identity, await QueryAsync(port, "*IDN?"));
        Assert.Equal("+9.90000000E+37", await QueryAsync(port, "READ?"));
    }

    [SocatFact]
    public async Task Drop_OverSerial_GoesSilentThenAnswersAgain()
    {
        await using var pair = await SocatPair.StartAsync();
        var clock = Benches.FakeClock();
        await using var bench = new SimulatedBench(Benches.Manual(), clock);
        await bench.StartSerialAsync(pair.EndA);
        using var port = Open(pair.EndB);
        bench.Faults.Inject(FaultKind.DropConnection);

        await Assert.ThrowsAsync<TimeoutException>(() => QueryAsync(port, "*IDN?", TimeSpan.FromMilliseconds(300)));
        await Assert.ThrowsAsync<TimeoutException>(() => QueryAsync(port, "*IDN?", TimeSpan.FromMilliseconds(300)));
        clock.Advance(TimeSpan.FromSeconds(3)); // FaultOptions.SerialSilence default

        Assert.Equal(bench.Identity, await QueryAsync(port, "*IDN?"));
        Assert.Equal(1, bench.Faults.Log.Count(FaultKind.DropConnection));
    }

    private static SerialPort Open(string path)
    {
        var port = new SerialPort(path, 9600) { NewLine = "\n" };
        port.Open();
        return port;
    }

    private static async Task<string> QueryAsync(SerialPort port, string query, TimeSpan? timeout = null)
    {
        await port.BaseStream.WriteAsync(System.Text.Encoding.ASCII.GetBytes(query + "\n"));
        var line = new List<byte>();
        var buffer = new byte[256];
        using var cts = new CancellationTokenSource(timeout ?? TimeSpan.FromSeconds(10));
        try
        {
            while (true)
            {
                var n = await port.BaseStream.ReadAsync(buffer, cts.Token);
                for (var i = 0; i < n; i++)
                {
                    if (buffer[i] == '\n')
                    {
                        return System.Text.Encoding.ASCII.GetString([.. line]);
                    }

                    line.Add(buffer[i]);
                }
            }
        }
        catch (OperationCanceledException)
        {
            throw new TimeoutException($"No reply to {query}");
        }
    }
}
