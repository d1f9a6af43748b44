using System.Globalization;
using SortRig.Planning.Ordering;
using Spectre.Console;

namespace SortRig.Host.OrderVerb;

/// <summary>Shows the trials' progress on a long run: one line per quarter of each phase once a second has
/// passed.</summary>
internal sealed class OrderProgressView(IAnsiConsole console) : IProgress<OrderProgress>
{
    private static readonly TimeSpan s_quiet = TimeSpan.FromSeconds(1);
    private readonly Lock _gate = new();
    private readonly Dictionary<string, int> _shown = [];

    public void Report(OrderProgress value)
    {
        var quarter = value.Done * 4 / value.Total;
        lock (_gate)
        {
            if (value.Elapsed < s_quiet || _shown.GetValueOrDefault(value.Phase, -1) >= quarter)
            {
                return;
            }

            _shown[value.Phase] = quarter;
            console.MarkupLine(
                Markup.Escape(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"  trials ({value.Phase}): {value.Done} of {value.Total}, {value.Elapsed.TotalSeconds:0.0} s"
                    )
                )
            );
        }
    }
}
