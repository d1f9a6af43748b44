namespace SortRig.Host.ReportVerb;

/// <summary>
/// Where the report verb may write: a folder that is not a symbolic link, holds no symbolic link (a planted link
/// would make the writer overwrite its target, outside the folder), and is new or empty unless --force says the
/// report in it may be replaced. Checked before anything is written.
/// </summary>
internal static class ReportFolderGuard
{
    /// <summary>Throws <see cref="ArgumentException"/> naming --out when the folder must not be written.</summary>
    public static void Check(string output, bool force)
    {
        if (File.Exists(output) && !Directory.Exists(output))
        {
            throw new ArgumentException($"--out: '{output}' is a file; give a folder for the report.", nameof(output));
        }

        var folder = new DirectoryInfo(output);
        if (!folder.Exists)
        {
            return;
        }

        if (folder.LinkTarget is not null)
        {
            throw new ArgumentException($"--out: '{output}' is a symbolic link; give a real folder.", nameof(output));
        }

        var entries = folder.GetFileSystemInfos();
        if (entries.FirstOrDefault(e => e.LinkTarget is not null) is { } link)
        {
            throw new ArgumentException(
                $"--out: '{output}' holds a symbolic link ({link.Name}); a report is never written through a link.",
                nameof(output)
            );
        }

        if (entries.Length > 0 && !force)
        {
            throw new ArgumentException(
                $"--out: folder '{output}' is not empty; add --force to replace the report in it, or choose a new "
                    + $"folder.",
                nameof(output)
            );
        }
    }
}
