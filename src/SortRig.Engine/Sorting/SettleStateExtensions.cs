using SortRig.Engine.Events;
using SortRig.Instruments.Drivers;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

internal static class SettleStateExtensions
{
    /// <summary>True while a part is in the fixture and not yet decided.</summary>
    public static bool IsBusy(this SettleState state) => state is SettleState.Bouncing or SettleState.Settling;
}
