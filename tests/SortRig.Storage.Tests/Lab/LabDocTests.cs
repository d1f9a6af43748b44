using SortRig.Storage.Lab;

namespace SortRig.Storage.Tests.Lab;

/// <summary>The keeper's page shows the role setup exactly as the code runs it (docs/lab.md, marked block).</summary>
public sealed class LabDocTests
{
    [Fact]
    public void LabPage_ShowsTheRoleScriptUnchanged()
    {
        var page = File.ReadAllText(Path.Combine(RepositoryRoot(), "docs", "lab.md")).ReplaceLineEndings("\n");
        const string marker = "<!-- lab-roles: LabRoles.Script(new LabRoleNames(), \"sortrig\") -->\n```sql\n";
        int start = page.IndexOf(marker, StringComparison.Ordinal);
        Assert.True(start >= 0, "docs/lab.md lost its lab-roles block");
        start += marker.Length;
        var shown = page[start..page.IndexOf("\n```", start, StringComparison.Ordinal)];

        Assert.Equal(LabRoles.Script(new LabRoleNames(), "sortrig").ReplaceLineEndings("\n").Trim(), shown.Trim());
    }

    private static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "docs", "lab.md")))
            {
                return dir.FullName;
            }
        }

        throw new DirectoryNotFoundException("docs/lab.md not found above the test assembly");
    }
}
