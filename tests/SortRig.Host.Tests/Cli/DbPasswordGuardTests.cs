using System.Diagnostics;
using SortRig.Host.Cli;
using SortRig.Host.Tests.Reliability.Support;

namespace SortRig.Host.Tests.Cli;

/// <summary>
/// A password typed into --db would sit in the process list (/proc/PID/cmdline is readable by every local user:
/// proc(5), Linux man-pages) and in shell history. Every verb with --db refuses it with one line and exit 2.
/// </summary>
public sealed class DbPasswordGuardTests
{
    [Theory]
    [InlineData("sort", "--plain")]
    [InlineData("drift", "--channels", "101-102")]
    [InlineData("library", "find")]
    [InlineData("plan", "--session", "bench", "--recipe", "matched-quad")]
    [InlineData("report", "--out", "rep")]
    public void Db_WithPassword_IsRefusedInOneLine_Exit2(params string[] verb)
    {
        var parse = Program.Parse([.. verb, "--db", "Host=lab-db;Username=sortrig_writer;Password=hunter-2-lab"]);
        using var error = new StringWriter();

        Assert.True(ParseErrors.Report(parse, error));
        var text = error.ToString().TrimEnd();
        Assert.Single(text.Split('\n'));
        Assert.StartsWith("error: --db: the connection string holds a password", text, StringComparison.Ordinal);
        Assert.DoesNotContain("hunter-2-lab", text, StringComparison.Ordinal);
        Assert.Equal(2, ParseErrors.BadInput); // what Program.Main returns when Report found an error
    }

    [Fact]
    public async Task Process_SortWithPasswordInDb_Exit2_OneLineOnStderr_NothingStarted()
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-dbpw-");
        try
        {
            var run = await HostProcess.RunAsync(
                dir.FullName,
                ["sort", "--plain", "--db", "Host=127.0.0.1;Port=1;Username=bench;Password=hunter-2-lab"],
                null,
                null,
                null,
                TimeSpan.FromMinutes(1)
            );

            Assert.Equal(2, run.ExitCode);
            Assert.Empty(run.Lines);
            var error = run.Log.TrimEnd();
            Assert.Single(error.Split('\n'));
            Assert.StartsWith("error: --db: the connection string holds a password", error, StringComparison.Ordinal);
            Assert.DoesNotContain("hunter-2-lab", error, StringComparison.Ordinal);
            Assert.Empty(dir.GetFileSystemInfos()); // no log folder, no database: refused before the host was built
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    [Fact]
    public void Db_WithPassfileOrNoPassword_IsAccepted()
    {
        Assert.Empty(
            Program
                .Parse(["library", "find", "--db", "Host=lab-db;Username=sortrig_writer;Passfile=/etc/sortrig/pgpass"])
                .Errors
        );
        Assert.Empty(Program.Parse(["library", "find", "--db", "Host=lab-db;Username=sortrig_writer"]).Errors);
        Assert.Empty(Program.Parse(["library", "find", "--db", "bench.db"]).Errors);
    }

    [Fact]
    public async Task Help_DefaultDatabaseFromTheEnvironment_ShowsItsPasswordMasked()
    {
        // The default of --db is SORTRIG_Sort__Database, which may carry a password; --help printed it whole.
        var start = new ProcessStartInfo("dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (var a in new[] { HostProcess.HostDll, "library", "find", "--help" })
        {
            start.ArgumentList.Add(a);
        }

        start.Environment["SORTRIG_Sort__Database"] = "Host=lab-db;Username=sortrig_writer;Password=hunter-2-lab";
        using var process = Process.Start(start)!;
        var text = await process.StandardOutput.ReadToEndAsync() + await process.StandardError.ReadToEndAsync();
        await process.WaitForExitAsync();

        Assert.Contains("host=lab-db;username=sortrig_writer;password=***", text, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("hunter-2-lab", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_NoDb_UsesTheDefaultUnmasked()
    {
        var parse = Program.Parse(["library", "find"]);
        var db = parse.CommandResult.Command.Options.Single(o => o.Name == "--db");

        Assert.Equal(SortRig.Host.VerbSupport.VerbGuard.DefaultDatabase(), parse.GetValue<string>(db.Name));
    }
}
