using System.IO.Ports;
using SortRig.Instruments.Resources;

namespace SortRig.Instruments.Tests.Resources;

/// <summary>
/// Resource strings per the IVI VISA address grammar (VPP-4.3 sec. 4.3.1.1, from memory):
/// keywords are case-insensitive, the board number is optional and defaults to 0, the
/// resource class defaults to INSTR. Our extensions are described in docs/instruments.md.
/// </summary>
public sealed class ResourceStringParserTests
{
    [Fact]
    public void Socket_WithBoardAndPort_Parsed()
    {
        // VPP-4.3: TCPIP[board]::host address::port::SOCKET
        var r = Assert.IsType<TcpSocketResource>(ResourceStringParser.Parse("TCPIP1::192.168.7.20::5025::SOCKET"));
        Assert.Equal((1, "192.168.7.20", 5025), (r.Board, r.Host, r.Port));
    }

    [Fact]
    public void Keywords_AnyCase_Accepted()
    {
        // VPP-4.3: keywords are case-insensitive.
        var r = Assert.IsType<TcpSocketResource>(ResourceStringParser.Parse("tcpip::meter-3.lab::5025::socket"));
        Assert.Equal((0, "meter-3.lab"), (r.Board, r.Host));
    }

    [Fact]
    public void Socket_Ipv6InBrackets_KeepsItsColons()
    {
        var r = Assert.IsType<TcpSocketResource>(ResourceStringParser.Parse("TCPIP::[fe80::1]::5025::SOCKET"));
        Assert.Equal("fe80::1", r.Host);
    }

    [Fact]
    public void Socket_WithoutPort_UsesScpiPort5025()
    {
        // Our extension; 5025 for raw SCPI sockets is common practice, no source.
        Assert.Equal(5025, Assert.IsType<TcpSocketResource>(ResourceStringParser.Parse("TCPIP::meter::SOCKET")).Port);
    }

    [Theory]
    [InlineData("TCPIP::10.0.0.9::INSTR", "inst0")]
    [InlineData("TCPIP0::10.0.0.9::hislip0::INSTR", "hislip0")]
    [InlineData("TCPIP::10.0.0.9", "inst0")]
    public void Instr_ParsedWithDeviceName(string text, string device)
    {
        // VPP-4.3: TCPIP[board]::host address[::LAN device name][::INSTR], default device inst0 (from memory).
        var r = Assert.IsType<VxiInstrumentResource>(ResourceStringParser.Parse(text));
        Assert.Equal(("10.0.0.9", device), (r.Host, r.DeviceName));
    }

    [Fact]
    public void Serial_BoardNumber_MapsToTtyS()
    {
        // VPP-4.3: ASRL[board]::INSTR; ASRL1 = first port = /dev/ttyS0 on Linux (common practice, no source).
        var r = Assert.IsType<SerialResource>(ResourceStringParser.Parse("ASRL1::INSTR"));
        Assert.Equal("/dev/ttyS0", r.DevicePath);
    }

    [Fact]
    public void Serial_DevicePathAndOptions_Parsed()
    {
        var r = Assert.IsType<SerialResource>(
            ResourceStringParser.Parse("ASRL::/dev/ttyUSB0::INSTR?baud=19200&parity=even&data=7&stop=2&flow=xon")
        );
        Assert.Equal("/dev/ttyUSB0", r.DevicePath);
        Assert.Equal(new SerialOverrides(19200, Parity.Even, 7, StopBits.Two, Handshake.XOnXOff), r.Settings);
    }

    [Fact]
    public void Usb_VisaForm_ParsedWithHexIds()
    {
        // VPP-4.3: USB[board]::manufacturer ID::model code::serial number[::USB interface number][::INSTR]
        var r = Assert.IsType<UsbInstrumentResource>(
            ResourceStringParser.Parse("USB0::0x1234::0x5678::SN000123::0::INSTR")
        );
        Assert.Equal((0x1234, 0x5678, "SN000123", (int?)0), (r.VendorId, r.ProductId, r.SerialNumber, r.Interface));
    }

    [Fact]
    public void UsbTmcAndSimulator_OurForms_Parsed()
    {
        Assert.Equal(
            "/dev/usbtmc0",
            Assert.IsType<UsbTmcResource>(ResourceStringParser.Parse("USBTMC::/dev/usbtmc0::INSTR")).DevicePath
        );
        Assert.Equal(
            "bench-a",
            Assert.IsType<SimulatorResource>(ResourceStringParser.Parse("sim::bench-a::instr")).Name
        );
    }

    [Theory]
    [InlineData(
        "TCPIP::host::notaport::SOCKET",
        3,
        "notaport",
        "TCPIP::host::notaport::SOCKET: part 3 'notaport' is not a port number 1-65535"
    )]
    [InlineData("TCPIP::host::70000::SOCKET", 3, "70000", null)]
    [InlineData("GPIB0::12::INSTR", 1, "GPIB0", null)]
    [InlineData("TCPIP::bad_host!::5025::SOCKET", 2, "bad_host!", null)]
    [InlineData("TCPIP::host::5025::extra::SOCKET", 4, "extra", null)]
    [InlineData("ASRL0::INSTR", 1, "ASRL0", null)]
    [InlineData("ASRL::ttyUSB0::INSTR", 2, "ttyUSB0", null)]
    [InlineData("ASRL1::/dev/ttyS1::INSTR", 2, "/dev/ttyS1", null)]
    [InlineData("ASRL::/dev/ttyS0::SOCKET", 3, "SOCKET", null)]
    [InlineData("USB::0xZZZZ::0x5678::SN1::INSTR", 2, "0xZZZZ", null)]
    [InlineData("USB::0x1234::0x5678::INSTR", 4, "INSTR", null)]
    [InlineData("USBTMC3::/dev/usbtmc0::INSTR", 1, "USBTMC3", null)]
    [InlineData("SIM::two words::INSTR", 2, "two words", null)]
    public void BadString_ErrorNamesTheOffendingPart(string text, int part, string partText, string? message)
    {
        var ex = Assert.Throws<ResourceStringException>(() => ResourceStringParser.Parse(text));
        Assert.Equal((part, partText), (ex.PartNumber, ex.PartText));
        Assert.Equal(partText, text.Substring(ex.Offset, partText.Length));
        Assert.False(string.IsNullOrEmpty(ex.Expected));
        if (message is not null)
        {
            Assert.Equal(message, ex.Message);
        }
    }

    [Theory]
    [InlineData("ASRL1::INSTR?baud=fast", 1, "baud=fast")]
    [InlineData("ASRL1::INSTR?baud=9600&parity=maybe", 2, "parity=maybe")]
    [InlineData("ASRL1::INSTR?speed=9600", 1, "speed=9600")]
    [InlineData("ASRL1::INSTR?data=8&data=7", 2, "data=7")]
    public void BadSerialOption_ErrorNamesTheOption(string text, int option, string optionText)
    {
        var ex = Assert.Throws<ResourceStringException>(() => ResourceStringParser.Parse(text));
        Assert.True(ex.IsOption);
        Assert.Equal((option, optionText), (ex.PartNumber, ex.PartText));
        Assert.Equal(optionText, text.Substring(ex.Offset, optionText.Length));
    }

    [Fact]
    public void SerialOptions_OnTcpResource_Rejected()
    {
        var ex = Assert.Throws<ResourceStringException>(() =>
            ResourceStringParser.Parse("TCPIP::h::5025::SOCKET?baud=9600")
        );
        Assert.Contains("ASRL", ex.Message, StringComparison.Ordinal);
    }
}
