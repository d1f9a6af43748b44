namespace SortRig.Host.Tests.Cli;

/// <summary>
/// The sort verb as a new user meets it, run as a process: a bad value is one line naming the flag as
/// typed, exit code 2, no stack trace, and nothing is started or created (no database, no log folder;
/// <see cref="BadInput"/>).
/// </summary>
public sealed class SortBadInputTests
{
    [Theory]
    [InlineData("--match", "0", "--match")]
    [InlineData("--cups", "0", "--cups")]
    [InlineData("--nominal", "abc", "--nominal")]
    [InlineData("--resource", "foo", "--resource")]
    [InlineData("--assigner", "biggest", "--assigner")]
    [InlineData("--tolerance", "1 percent", "--tolerance")]
    [InlineData("--settle", "guess", "--settle")]
    [InlineData("--physics", "quantum", "--physics")]
    [InlineData("--db", "/dev/null", "--db")] // a device: SQLite would leave a journal beside it
    // was: two stack traces ending in "unable to open database file"
    [InlineData("--db", "/no-such-folder-sortrig/bench.db", "--db")]
    [InlineData("--db", "/proc/bench.db", "--db")] // a folder that cannot be written, even by root
    public Task Sort_BadValue_OneLineNamingTheFlag_Exit2_NothingCreated(string flag, string value, string named) =>
        BadInput.AssertRefusedAsync(["sort", flag, value, "--plain", "--no-speech"], named, value);

    [Fact]
    public Task Sort_SpeedWithARealMeter_Refused_Exit2() =>
        BadInput.AssertRefusedAsync(["sort", "--speed", "5", "--resource", RealMeter], "--speed", "");

    [Fact]
    public Task Sort_PhysicsWithARealMeter_Refused_Exit2() =>
        BadInput.AssertRefusedAsync(["sort", "--physics", "rich", "--resource", RealMeter], "--physics", "");

    private const string RealMeter = "TCPIP::127.0.0.1::5025::SOCKET";
}
