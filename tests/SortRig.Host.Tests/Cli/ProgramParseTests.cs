namespace SortRig.Host.Tests.Cli;

public sealed class ProgramParseTests
{
    // System.CommandLine reads "@file" as a file of arguments by default (a response file); a storage location such as
    // "@bag 7" must stay the value typed. Common practice, no source.
    [Fact]
    public void Parse_ValueStartingWithAt_IsTheValue_NotAResponseFile()
    {
        var parse = Program.Parse(["library", "locate", "--db", "x.db", "--id", "3", "--at", "@bag 7"]);

        Assert.Empty(parse.Errors);
        Assert.Contains(parse.Tokens, t => t.Value == "@bag 7");
    }

    [Theory]
    [InlineData(new[] { "library", "take" }, "(sortrig library take --help lists the options)")]
    [InlineData(new[] { "sort", "--bogus" }, "(sortrig sort --help lists the options)")]
    [InlineData(new string[0], "(sortrig --help lists the options)")]
    public void ParseError_NamesTheWholeCommandPath_AsTheProgramIsCalled(string[] args, string hint)
    {
        var error = new StringWriter();

        Assert.True(SortRig.Host.Cli.ParseErrors.Report(Program.Parse(args), error));

        var line = Assert.Single(error.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.EndsWith(hint, line.TrimEnd(), StringComparison.Ordinal);
    }

    // A misspelt verb is named as typed, with the verbs there are (the bad-input rule: one line naming what was
    // written). Common practice, no source.
    [Fact]
    public void ParseError_UnknownVerb_NamesItAndListsTheVerbs()
    {
        var error = new StringWriter();

        Assert.True(SortRig.Host.Cli.ParseErrors.Report(Program.Parse(["srot", "--parts", "4"]), error));

        var line = Assert.Single(error.ToString().Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.StartsWith(
            "error: 'srot' is not a verb of sortrig; the verbs are sort, ",
            line,
            StringComparison.Ordinal
        );
        Assert.Contains(" plan", line, StringComparison.Ordinal);
    }

    [Fact]
    public void Plan_TakesThePickedPartsWithByAsLibraryTakeDoes()
    {
        var parse = Program.Parse(["plan", "--session", "bench", "--recipe", "r.yaml", "--by", "Ana"]);

        Assert.Empty(parse.Errors);
        Assert.Equal("Ana", parse.GetValue<string?>("--take"));
    }

    [Fact]
    public async Task Help_UsageLine_CallsTheProgramSortrig()
    {
        var output = new StringWriter();
        var parse = Program.Parse(["sort", "--help"]);

        await parse.InvokeAsync(new System.CommandLine.InvocationConfiguration { Output = output });

        Assert.Contains("sortrig sort [options]", output.ToString(), StringComparison.Ordinal);
        Assert.DoesNotContain("SortRig.Host", output.ToString(), StringComparison.Ordinal);
    }
}

/// <summary>Verbs that read the precision log never create one: a misspelt --db is named, exit 2, no file
/// appears.</summary>
public sealed class MissingDatabaseTests
{
    [Theory]
    [InlineData("library", "find")]
    [InlineData("library", "export", "--csv", "-")]
    [InlineData("library", "labels", "--ids", "1,2")]
    [InlineData("plan", "--session", "bench", "--recipe", "recipes/matched-quad.yaml")]
    [InlineData("report", "--out", "rep")]
    [InlineData("reach", "--recipe", "matched-quad", "--sets", "2")]
    [InlineData("order", "--recipe", "matched-quad", "--sets", "2", "--from-session", "bench")]
    public async Task ReadingVerb_MisspeltDb_Exit2_NamesIt_CreatesNothing(params string[] verb)
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-nodb-");
        try
        {
            var db = Path.Combine(dir.FullName, "sortirg.db");
            var code = await Program.Parse([.. verb, "--db", db]).InvokeAsync();

            Assert.Equal(2, code);
            Assert.False(File.Exists(db));
            Assert.Empty(dir.GetFileSystemInfos());
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }
}
