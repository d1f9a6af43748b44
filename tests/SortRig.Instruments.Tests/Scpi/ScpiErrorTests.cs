using SortRig.Instruments.Scpi;

namespace SortRig.Instruments.Tests.Scpi;

public sealed class ScpiErrorTests
{
    [Theory]
    // SCPI-99 vol. 2 ch. 21: code ranges of the error/event classes (-113 "Undefined header",
    // -222 "Data out of range", -350 "Queue overflow", -410 "Query INTERRUPTED" are its examples, from memory)
    [InlineData(0, ScpiErrorClass.None)]
    [InlineData(-100, ScpiErrorClass.Command)]
    [InlineData(-113, ScpiErrorClass.Command)]
    [InlineData(-199, ScpiErrorClass.Command)]
    [InlineData(-200, ScpiErrorClass.Execution)]
    [InlineData(-222, ScpiErrorClass.Execution)]
    [InlineData(-350, ScpiErrorClass.DeviceSpecific)]
    [InlineData(-410, ScpiErrorClass.Query)]
    [InlineData(-500, ScpiErrorClass.PowerOn)]
    [InlineData(-800, ScpiErrorClass.OperationComplete)]
    [InlineData(-42, ScpiErrorClass.Reserved)]
    [InlineData(201, ScpiErrorClass.DeviceDefined)]
    public void Classify_ByScpi99CodeRange(int code, ScpiErrorClass expected) =>
        Assert.Equal(expected, ScpiError.Classify(code));

    [Theory]
    // SCPI-99 vol. 2 sec. 21.8: <code>,"<description>[;<device-dependent info>]"
    [InlineData("-113,\"Undefined header\"", -113, "Undefined header")]
    [InlineData("+0,\"No error\"", 0, "No error")]
    [InlineData("-222,\"Data out of range;RANG 7\"", -222, "Data out of range;RANG 7")]
    [InlineData("-101,\"Invalid character \"\"#\"\"\"", -101, "Invalid character \"#\"")]
    public void Parse_ErrorQueueEntry(string reply, int code, string message)
    {
        var e = ScpiError.Parse(reply, "SYST:ERR?");
        Assert.Equal((code, message), (e.Code, e.Message));
    }

    [Theory]
    [InlineData("No error")]
    [InlineData("-1.5,\"x\"")]
    [InlineData("")]
    public void Parse_NotAnEntry_ThrowsResponseException(string reply)
    {
        var ex = Assert.Throws<ScpiResponseException>(() => ScpiError.Parse(reply, "SYST:ERR?"));
        Assert.Equal(("SYST:ERR?", reply), (ex.Command, ex.Reply));
    }

    [Fact]
    public void Identity_FourFields_ParsedAndTrimmed()
    {
        // IEEE 488.2 sec. 10.14 (*IDN?): manufacturer, model, serial number, firmware level (from memory)
        var id = InstrumentIdentity.Parse("Bench Test Works, SIM-6H ,SN0042,1.02,build 7");
        Assert.Equal(new InstrumentIdentity("Bench Test Works", "SIM-6H", "SN0042", "1.02,build 7"), id);
    }

    [Fact]
    public void Identity_ThreeFields_ThrowsResponseException() =>
        Assert.Throws<ScpiResponseException>(() => InstrumentIdentity.Parse("Maker,Model,1"));
}
