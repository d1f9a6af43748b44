using System.Diagnostics;

namespace SortRig.Tests.Support;

/// <summary>A small tmpfs mounted for one test (needs root), unmounted at the end.</summary>
internal sealed class Tmpfs : IAsyncDisposable
{
    private Tmpfs(string path) => Path = path;

    public string Path { get; }

    /// <summary>Mounts, or returns null with the reason when mounting is not permitted here.</summary>
    public static async Task<(Tmpfs? Mount, string Why)> MountAsync(string sizeSpec)
    {
        var path = Directory.CreateTempSubdirectory("sortrig-tmpfs-").FullName;
        var (code, text) = await Shell.RunAsync("mount", "-t", "tmpfs", "-o", $"size={sizeSpec}", "tmpfs", path);
        if (code == 0)
        {
            return (new Tmpfs(path), "");
        }

        Directory.Delete(path);
        return (null, text);
    }

    public async ValueTask DisposeAsync()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        await Shell.RunAsync("umount", "-l", Path);
        Directory.Delete(Path, recursive: true);
    }
}

/// <summary>Runs a system command, returns its exit code and output.</summary>
internal static class Shell
{
    public static async Task<(int Code, string Output)> RunAsync(string file, params string[] args)
    {
        var start = new ProcessStartInfo(file)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (var a in args)
        {
            start.ArgumentList.Add(a);
        }

        using var p = Process.Start(start)!;
        var output = await p.StandardOutput.ReadToEndAsync() + await p.StandardError.ReadToEndAsync();
        await p.WaitForExitAsync();
        return (p.ExitCode, output.Trim());
    }
}
