using System.Diagnostics;
using System.Text;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Tests.Transports;

/// <summary>
/// The USBTMC link is plain file I/O on /dev/usbtmcN. No usbtmc device exists here, so the
/// open, write and read paths are tested against a named pipe made with mkfifo (a real kernel
/// character stream, not a device: USBTMC message framing itself is not exercised).
/// </summary>
public sealed class UsbTmcMessageLinkTests : IDisposable
{
    private readonly string _fifo = $"/tmp/sortrig-usbtmc-{Guid.NewGuid():N}";

    public UsbTmcMessageLinkTests()
    {
        using var mkfifo = Process.Start("mkfifo", _fifo);
        mkfifo.WaitForExit();
        Assert.Equal(0, mkfifo.ExitCode);
    }

    public void Dispose() => File.Delete(_fifo);

    [Fact]
    public async Task WriteLine_ReachesReaderOfTheDeviceFile()
    {
        await using var link = await Open();
        var reader = Task.Run(() =>
        {
            using var fifo = new FileStream(_fifo, FileMode.Open, FileAccess.Read);
            var buffer = new byte[6];
            fifo.ReadExactly(buffer);
            return Encoding.ASCII.GetString(buffer);
        });
        await link.WriteLineAsync("*IDN?", CancellationToken.None);
        Assert.Equal("*IDN?\n", await reader.WaitAsync(TimeSpan.FromSeconds(5)));
    }

    [Fact]
    public async Task ReadLine_ReturnsWhatWasWrittenIntoTheDeviceFile()
    {
        await using var link = await Open();
        await using (var writer = new FileStream(_fifo, FileMode.Open, FileAccess.Write))
        {
            await writer.WriteAsync(Encoding.ASCII.GetBytes("+9.90000000E+37\n"));
        }

        Assert.Equal("+9.90000000E+37", await link.ReadLineAsync(TimeSpan.FromSeconds(5), CancellationToken.None));
    }

    [Fact]
    public async Task Open_MissingDevice_ThrowsLinkExceptionNamingThePath()
    {
        var resource = ResourceStringParser.Parse("USBTMC::/dev/usbtmc-absent-99::INSTR");
        var ex = await Assert.ThrowsAsync<InstrumentLinkException>(() =>
            new MessageLinkFactory()
                .OpenAsync(resource, MessageLinkOptions.Default, null, CancellationToken.None)
                .AsTask()
        );
        Assert.Contains("no such device '/dev/usbtmc-absent-99'", ex.Message, StringComparison.Ordinal);
        Assert.True(ex.OpenFailed);
    }

    [Fact]
    public async Task Open_MissingSerialDevice_SaysNoSuchDevice_NotAccessDenied()
    {
        // SerialPort alone reports a missing /dev/tty* as "access denied" (seen on this machine kind).
        var resource = ResourceStringParser.Parse("ASRL::/dev/ttyUSB-absent-99::INSTR");
        var ex = await Assert.ThrowsAsync<InstrumentLinkException>(() =>
            new MessageLinkFactory()
                .OpenAsync(resource, MessageLinkOptions.Default, null, CancellationToken.None)
                .AsTask()
        );
        Assert.Contains(
            "no such device '/dev/ttyUSB-absent-99'; check the cable",
            ex.Message,
            StringComparison.Ordinal
        );
        Assert.DoesNotContain("denied", ex.Message, StringComparison.OrdinalIgnoreCase);
        Assert.True(ex.OpenFailed);
    }

    private async Task<IMessageLink> Open() =>
        await new MessageLinkFactory().OpenAsync(
            ResourceStringParser.Parse($"USBTMC::{_fifo}::INSTR"),
            MessageLinkOptions.Default,
            null,
            CancellationToken.None
        );
}
