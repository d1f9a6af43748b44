using Microsoft.Extensions.Hosting;

namespace SortRig.Host.Tests.Drift;

/// <summary>The application lifetime at the edge: the worker only asks it to stop.</summary>
internal sealed class StopOnlyLifetime : IHostApplicationLifetime, IDisposable
{
    private readonly CancellationTokenSource _stopping = new();

    public bool Stopped => _stopping.IsCancellationRequested;

    public CancellationToken ApplicationStarted => CancellationToken.None;

    public CancellationToken ApplicationStopping => _stopping.Token;

    public CancellationToken ApplicationStopped => CancellationToken.None;

    public void StopApplication() => _stopping.Cancel();

    public void Dispose() => _stopping.Dispose();
}
