using Microsoft.Extensions.Logging;
using SortRig.Engine.Composition;
using SortRig.Engine.Events;
using SortRig.Engine.Simulation;
using SortRig.Instruments.Drivers;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Transports;
using SortRig.Simulator;
using SortRig.Storage;

namespace SortRig.Engine.DriftLogging;

/// <summary>Shared services of one drift run, owned by whoever hosts it (the drift verb, the worker or a
/// test).</summary>
/// <param name="Time">Clock of the logger, the meter driver and the embedded simulator (scaled or virtual for the
/// simulator).</param>
/// <param name="LinkTime">Clock of link timeouts (connect, write, reply): the system clock, so that a scaled or
/// virtual bench clock never times out real socket I/O.</param>
/// <param name="Hub">Event stream (samples and notices).</param>
/// <param name="Loggers">Logging.</param>
public sealed record DriftServices(TimeProvider Time, TimeProvider LinkTime, BenchEventHub Hub, ILoggerFactory Loggers);
