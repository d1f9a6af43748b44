using Microsoft.Extensions.Hosting;
using SortRig.Engine.Operator;

namespace SortRig.Host.Operator;

/// <summary>Reads single keys from an interactive console and posts operator actions.</summary>
internal sealed class KeyboardInput(OperatorCommands commands, TimeProvider time) : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        if (Console.IsInputRedirected)
        {
            return;
        }

        while (!stoppingToken.IsCancellationRequested)
        {
            if (
                Console.KeyAvailable
                && OperatorCommands.FromKey(Console.ReadKey(intercept: true).KeyChar) is { } command
            )
            {
                commands.Post(command);
                continue;
            }

            await Task.Delay(TimeSpan.FromMilliseconds(50), time, stoppingToken).ConfigureAwait(false);
        }
    }
}
