namespace SortRig.Instruments.Transports;

/// <summary>
/// SCPI lines through the Linux usbtmc driver's character device (/dev/usbtmcN): plain file
/// reads and writes, the kernel does the USBTMC framing.
/// </summary>
internal sealed class UsbTmcMessageLink : StreamMessageLink
{
    // Linux errno ETIMEDOUT: the usbtmc driver's own bulk-in timeout expired with no data.
    private const int LinuxTimedOut = 110;

    private UsbTmcMessageLink(string endpoint, Stream stream, MessageLinkOptions options, TimeProvider time)
        : base(endpoint, stream, options, time) { }

    /// <summary>Opens the device read/write, unbuffered.</summary>
    public static IMessageLink Open(string devicePath, MessageLinkOptions options, TimeProvider time)
    {
        var endpoint = $"usbtmc://{devicePath}";
        if (!File.Exists(devicePath))
        {
            throw new InstrumentLinkException(
                endpoint,
                $"no such device '{devicePath}'; check the cable and the device name (ls /dev/usbtmc*)",
                null,
                openFailed: true
            );
        }

        try
        {
            var stream = new FileStream(
                devicePath,
                new FileStreamOptions
                {
                    Mode = FileMode.Open,
                    Access = FileAccess.ReadWrite,
                    Share = FileShare.ReadWrite,
                    BufferSize = 0,
                }
            );
            return new UsbTmcMessageLink(endpoint, stream, options, time);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            throw new InstrumentLinkException(
                endpoint,
                $"could not open the device: {ex.Message}",
                ex,
                openFailed: true
            );
        }
    }

    protected override bool IsNoDataYet(Exception ex) => ex is IOException { HResult: LinuxTimedOut };
}
