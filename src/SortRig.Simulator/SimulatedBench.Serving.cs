using System.Net;
using Microsoft.Extensions.Logging;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Serving;

namespace SortRig.Simulator;

/// <summary>Serving over TCP and serial, and shutting down.</summary>
public sealed partial class SimulatedBench
{
    private readonly Lock _servingGate = new();
    private TcpScpiServer? _tcp;
    private SerialScpiServer? _serial;

    /// <summary>The TCP endpoint being served, or null.</summary>
    public IPEndPoint? TcpEndpoint => _tcp?.Endpoint;

    /// <summary>
    /// Serves SCPI on 127.0.0.1:<paramref name="port"/> (0 picks a free port) and returns the bound
    /// endpoint. Starts the operator when its mode is Auto.
    /// </summary>
    /// <exception cref="InvalidOperationException">Already serving TCP.</exception>
    public Task<IPEndPoint> StartTcpAsync(int port = 0, CancellationToken ct = default)
    {
        OptionGuard.InRange(port, 0, 65535, nameof(port));
        ct.ThrowIfCancellationRequested();
        lock (_servingGate)
        {
            ObjectDisposedException.ThrowIf(_lifetime.IsCancellationRequested, this);
            if (_tcp is not null)
            {
                throw new InvalidOperationException($"Already serving TCP on {_tcp.Endpoint}.");
            }

            _tcp = TcpScpiServer.Start(_device, port, Time, _loggers.CreateLogger<TcpScpiServer>(), _lifetime.Token);
        }

        StartOperatorIfAuto();
        return Task.FromResult(_tcp.Endpoint);
    }

    /// <summary>
    /// Serves SCPI on a serial device path (8N1, <see cref="SimulatedBenchOptions.SerialBaudRate"/>).
    /// Starts the operator when its mode is Auto.
    /// </summary>
    /// <exception cref="InvalidOperationException">Already serving serial.</exception>
    /// <exception cref="IOException">The device cannot be opened.</exception>
    public Task StartSerialAsync(string devicePath, CancellationToken ct = default)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(devicePath);
        ct.ThrowIfCancellationRequested();
        lock (_servingGate)
        {
            ObjectDisposedException.ThrowIf(_lifetime.IsCancellationRequested, this);
            if (_serial is not null)
            {
                throw new InvalidOperationException($"Already serving serial on {_serial.Path}.");
            }

            _serial = SerialScpiServer.Start(
                _device,
                devicePath,
                Options.SerialBaudRate,
                Time,
                _loggers.CreateLogger<SerialScpiServer>(),
                _lifetime.Token
            );
        }

        StartOperatorIfAuto();
        return Task.CompletedTask;
    }

    /// <summary>Stops serving (closes all connections) and stops the operator. The bench can serve again.</summary>
    public async Task StopAsync(CancellationToken ct = default)
    {
        TcpScpiServer? tcp;
        SerialScpiServer? serial;
        lock (_servingGate)
        {
            (tcp, serial, _tcp, _serial) = (_tcp, _serial, null, null);
        }

        if (tcp is not null)
        {
            await tcp.DisposeAsync().AsTask().WaitAsync(ct).ConfigureAwait(false);
        }

        if (serial is not null)
        {
            await serial.DisposeAsync().AsTask().WaitAsync(ct).ConfigureAwait(false);
        }

        await Operator.StopAsync().WaitAsync(ct).ConfigureAwait(false);
    }

    /// <summary>Stops everything and cancels background measurements.</summary>
    public async ValueTask DisposeAsync()
    {
        await StopAsync().ConfigureAwait(false);
        await _lifetime.CancelAsync().ConfigureAwait(false);
        _device.Context.Acquisition.Abort();
        _device.Dispose();
    }

    private void StartOperatorIfAuto()
    {
        if (Options.Operator.Mode == OperatorMode.Auto)
        {
            Operator.Start();
        }
    }
}
