using System.Text.Json;
using System.Text.RegularExpressions;
using SortRig.Storage.Contracts;

namespace SortRig.Host.Tests.Web;

/// <summary>
/// The JSON API answers in the shapes docs/web.md documents (field names read from the doc's
/// tables), with the values the precision log stores.
/// </summary>
[Collection(WebSortCollection.Name)]
public sealed partial class WebApiShapeTests
{
    [Fact]
    public async Task Api_AfterAShortSort_MatchesTheDocsAndThePrecisionLog()
    {
        await using var run = await WebSortRun.StartAsync(parts: 4, speed: 10);
        using var http = new HttpClient { BaseAddress = new Uri(run.BaseUrl) };
        var session = await run.WaitFinishedAsync(http, TimeSpan.FromSeconds(40));
        using var parts = JsonDocument.Parse(await http.GetStringAsync("/api/parts"));
        using var cups = JsonDocument.Parse(await http.GetStringAsync("/api/cups"));
        using var events = JsonDocument.Parse(await http.GetStringAsync("/api/events/recent"));
        await run.StopAsync();
        var docs = File.ReadAllText(Path.Combine(RepositoryRoot(), "docs", "web.md"));

        Assert.Equal(DocumentedFields(docs, "SessionView"), Fields(session));
        Assert.All(parts.RootElement.EnumerateArray(), p =>
            Assert.Equal(DocumentedFields(docs, "PartView"), Fields(p))
        );
        Assert.All(events.RootElement.EnumerateArray(), e =>
            Assert.Equal(DocumentedFields(docs, "BenchEvent"), Fields(e))
        );
        var kinds = events.RootElement.EnumerateArray().Select(e => e.GetProperty("kind").GetString()!).ToHashSet();
        Assert.Subset(DocumentedKinds(docs), kinds);

        // Values: the API against the log, which is the durable record.
        var stored = await run.StoredPartsAsync(session.GetProperty("sessionId").GetInt64());
        Assert.Equal(4, session.GetProperty("partsPlanned").GetInt32());
        Assert.Equal(
            stored.Select(p => (long)p.Number),
            parts.RootElement.EnumerateArray().Select(p => p.GetProperty("number").GetInt64())
        );
        Assert.Equal(
            stored.Select(p => p.CupLabel),
            parts.RootElement.EnumerateArray().Select(p => p.GetProperty("cup").GetString())
        );
        Assert.Equal(
            stored.Select(p => p.Value),
            parts.RootElement.EnumerateArray().Select(p => p.GetProperty("ohms").GetDouble())
        );
        var inCups = stored.Where(p => p.IsLive).GroupBy(p => p.CupLabel!).ToDictionary(g => g.Key, g => g.Count());
        var counted = cups
            .RootElement.EnumerateObject()
            .Where(c => c.Value.GetInt32() > 0)
            .ToDictionary(c => c.Name, c => c.Value.GetInt32());
        Assert.Equal(inCups.OrderBy(c => c.Key), counted.OrderBy(c => c.Key));
    }

    private static SortedSet<string> Fields(JsonElement element) =>
        new(element.EnumerateObject().Select(p => p.Name), StringComparer.Ordinal);

    // The rows "| `name` | ..." of the table under the heading "### <type>".
    private static SortedSet<string> DocumentedFields(string docs, string type)
    {
        var section = Regex.Match(
            docs,
            $@"^### {type}\b.*?(?=^#|\z)",
            RegexOptions.Multiline | RegexOptions.Singleline
        );
        Assert.True(section.Success, $"docs/web.md has no '### {type}' section");
        var fields = new SortedSet<string>(
            FieldRow().Matches(section.Value).Select(m => m.Groups[1].Value),
            StringComparer.Ordinal
        );
        Assert.NotEmpty(fields);
        return fields;
    }

    private static HashSet<string> DocumentedKinds(string docs)
    {
        var line = Regex.Match(docs, @"^\| `kind` \|.*$", RegexOptions.Multiline).Value;
        return [.. Regex.Matches(line, "`([A-Z][a-zA-Z]+)`").Select(m => m.Groups[1].Value)];
    }

    private static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "SortRig.sln")))
            {
                return dir.FullName;
            }
        }

        throw new InvalidOperationException("SortRig.sln not found above " + AppContext.BaseDirectory);
    }

    [GeneratedRegex(@"^\| `([a-zA-Z]+)` \|", RegexOptions.Multiline)]
    private static partial Regex FieldRow();
}
