using System.Diagnostics;
using Microsoft.Extensions.Logging;

namespace SortRig.Engine.Announcing;

/// <summary>
/// Speaks announcements through espeak-ng when it is installed; silently does nothing when not.
/// Speech runs in the background so a slow voice never holds the measurement loop.
/// </summary>
public sealed class SpeechAnnouncer : IAnnouncer
{
    private readonly string? _program;
    private readonly ILogger<SpeechAnnouncer> _logger;

    public SpeechAnnouncer(ILogger<SpeechAnnouncer> logger, string? program = null)
    {
        _logger = logger;
        _program = program ?? FindOnPath("espeak-ng");
    }

    /// <summary>True when a speech program was found.</summary>
    public bool Available => _program is not null;

    /// <inheritdoc />
    public ValueTask AnnounceAsync(Announcement announcement, CancellationToken cancellationToken)
    {
        if (_program is null)
        {
            return ValueTask.CompletedTask;
        }

        var words = Words(announcement);
        try
        {
            var start = new ProcessStartInfo(_program) { RedirectStandardError = true, UseShellExecute = false };
            start.ArgumentList.Add(words);
            using var process = Process.Start(start);
        }
        catch (Exception e) when (e is System.ComponentModel.Win32Exception or InvalidOperationException)
        {
            Log.SpeechFailed(_logger, e.Message);
        }

        return ValueTask.CompletedTask;
    }

    /// <summary>What is said: the cup label spelled clearly, never the raw numbers.</summary>
    public static string Words(Announcement a) =>
        a.Kind switch
        {
            AnnouncementKind.Cup or AnnouncementKind.Repeat => "cup "
                + a.Label
                + (a.CompletesSet ? ", set complete" : ""),
            AnnouncementKind.Reject => "reject",
            AnnouncementKind.Unstable => "unstable, reseat the part",
            _ => a.Text,
        };

    private static string? FindOnPath(string name)
    {
        var path = Environment.GetEnvironmentVariable("PATH") ?? "";
        return path.Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries)
            .Select(dir => Path.Combine(dir, name))
            .FirstOrDefault(File.Exists);
    }
}
