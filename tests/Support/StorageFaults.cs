using System.Diagnostics;

namespace SortRig.Tests.Support;

/// <summary>A real fault of the filesystem or of SQLite's locking, put on and taken off a database file.</summary>
internal interface IStorageFault : IAsyncDisposable
{
    /// <summary>Makes writes to the database fail.</summary>
    Task InjectAsync();

    /// <summary>Takes the fault away again.</summary>
    Task ClearAsync();
}

/// <summary>Another process holds SQLite's write lock (BEGIN EXCLUSIVE) on the file until cleared.</summary>
internal sealed class HeldLock(string db) : IStorageFault
{
    private Process? _holder;

    public static bool Available => File.Exists("/usr/bin/python3");

    public async Task InjectAsync()
    {
        var start = new ProcessStartInfo("python3")
        {
            RedirectStandardInput = true,
            RedirectStandardOutput = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add("-c");
        start.ArgumentList.Add(
            "import sqlite3,sys\n"
                + "c=sqlite3.connect(sys.argv[1],isolation_level=None,timeout=30)\n"
                + "c.execute('BEGIN "
                + "EXCLUSIVE')\nprint('locked',flush=True)\nsys.stdin.readline()\nc.execute('COMMIT')\n"
        );
        start.ArgumentList.Add(db);
        _holder = Process.Start(start) ?? throw new InvalidOperationException("python3 did not start");
        var line = await _holder.StandardOutput.ReadLineAsync();
        Assert.Equal("locked", line);
    }

    public async Task ClearAsync()
    {
        if (_holder is { } holder)
        {
            await holder.StandardInput.WriteLineAsync();
            await holder.WaitForExitAsync();
            holder.Dispose();
            _holder = null;
        }
    }

    public ValueTask DisposeAsync() => new(ClearAsync());
}

/// <summary>
/// The database and its WAL become immutable (chattr +i): on ext4 even writes through open file
/// handles fail (EPERM), and root cannot open them for writing; the way to make a file read-only to root.
/// </summary>
internal sealed class ReadOnlyFile(string db) : IStorageFault
{
    private readonly string[] _files = [db, db + "-wal"];

    public Task InjectAsync() => Chattr("+i");

    public Task ClearAsync() => Chattr("-i");

    public ValueTask DisposeAsync() => new(ClearAsync());

    private async Task Chattr(string flag)
    {
        foreach (var file in _files.Where(File.Exists))
        {
            var (code, text) = await Shell.RunAsync("chattr", flag, file);
            Assert.True(code == 0, $"chattr {flag} {file}: {text}");
        }
    }
}

/// <summary>The small tmpfs the database lives on is filled up by another file.</summary>
internal sealed class FullDisk(string mountPoint) : IStorageFault
{
    private readonly string _filler = Path.Combine(mountPoint, "filler.bin");

    public async Task InjectAsync()
    {
        var block = new byte[64 * 1024];
        await using var stream = new FileStream(
            _filler,
            FileMode.Create,
            FileAccess.Write,
            FileShare.None,
            1,
            FileOptions.None
        );
        try
        {
            while (true)
            {
                stream.Write(block);
                stream.Flush();
            }
        }
        catch (IOException)
        {
            // ENOSPC: full.
        }

        // The last partial block: fill byte by byte until nothing fits.
        try
        {
            while (true)
            {
                stream.WriteByte(0);
                stream.Flush();
            }
        }
        catch (IOException)
        {
            // Full to the last byte.
        }
    }

    public Task ClearAsync()
    {
        File.Delete(_filler);
        return Task.CompletedTask;
    }

    public ValueTask DisposeAsync() => new(ClearAsync());
}
