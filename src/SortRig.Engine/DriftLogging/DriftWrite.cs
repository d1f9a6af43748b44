using System.Threading.Channels;
using Microsoft.Extensions.Logging;
using SortRig.Engine.Durability;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.DriftLogging;

/// <summary>One item for the storage loop: a sample or a gap (exactly one is set).</summary>
internal readonly record struct DriftWrite(StoredDriftSample Sample, DriftGap? Gap);
