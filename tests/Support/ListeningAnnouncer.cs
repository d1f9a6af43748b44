using SortRig.Engine.Announcing;

namespace SortRig.Tests.Support;

/// <summary>
/// The operator's ears in a test: writes each announcement as its plain line (PlainTextAnnouncer's
/// format) and lets the test act on a line as it is said, inside the loop's call (before the loop
/// goes on), or wait for one.
/// </summary>
internal sealed class ListeningAnnouncer : IAnnouncer
{
    private readonly Lock _gate = new();
    private readonly List<string> _lines = [];
    private readonly List<(Func<string, bool> Match, TaskCompletionSource Heard)> _waits = [];

    /// <summary>Runs for every line as it is said (in the sorting loop's flow).</summary>
    public Action<string>? OnLine { get; set; }

    /// <summary>Everything said so far, one line each.</summary>
    public string Text
    {
        get
        {
            lock (_gate)
            {
                return string.Join('\n', _lines);
            }
        }
    }

    public ValueTask AnnounceAsync(Announcement announcement, CancellationToken cancellationToken)
    {
        var line = PlainTextAnnouncer.Describe(announcement);
        List<TaskCompletionSource> done;
        lock (_gate)
        {
            _lines.Add(line);
            done = _waits.Where(w => w.Match(line)).Select(w => w.Heard).ToList();
            _waits.RemoveAll(w => done.Contains(w.Heard));
        }

        OnLine?.Invoke(line);
        done.ForEach(d => d.TrySetResult());
        return ValueTask.CompletedTask;
    }

    /// <summary>Completes when a line matching <paramref name="match"/> is said (from now on).</summary>
    public Task HeardAsync(Func<string, bool> match, TimeSpan limit)
    {
        var heard = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        lock (_gate)
        {
            _waits.Add((match, heard));
        }

        return heard.Task.WaitAsync(limit);
    }
}
