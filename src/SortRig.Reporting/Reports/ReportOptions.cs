using SortRig.Reporting.Plots;

namespace SortRig.Reporting.Reports;

/// <summary>Options of <see cref="ReportWriter"/>; validated at construction.</summary>
public sealed record ReportOptions
{
    /// <summary>Creates options.</summary>
    /// <param name="plotSize">PNG size; default 1200 x 800 pixels.</param>
    /// <param name="summaryAveragingFactors">ADEV averaging factors m (tau = m tau0) listed in summary.md; each
    /// 1..1_000_000; default 1, 4, 16, 64, 256.</param>
    /// <param name="adevErrorBars">Draw 68 % error bars on ADEV plots; default true.</param>
    public ReportOptions(
        PlotSize? plotSize = null,
        IReadOnlyList<int>? summaryAveragingFactors = null,
        bool adevErrorBars = true
    )
    {
        IReadOnlyList<int> factors = summaryAveragingFactors ?? [1, 4, 16, 64, 256];
        foreach (int m in factors)
        {
            if (m is < 1 or > 1_000_000)
            {
                throw new ArgumentOutOfRangeException(
                    nameof(summaryAveragingFactors),
                    m,
                    "Each summary averaging factor must be within 1..1000000."
                );
            }
        }

        PlotSize = plotSize ?? PlotSize.Default;
        SummaryAveragingFactors = factors;
        AdevErrorBars = adevErrorBars;
    }

    /// <summary>PNG size of every plot.</summary>
    public PlotSize PlotSize { get; }

    /// <summary>ADEV averaging factors listed in summary.md (those the data allow).</summary>
    public IReadOnlyList<int> SummaryAveragingFactors { get; }

    /// <summary>Whether ADEV plots carry error bars.</summary>
    public bool AdevErrorBars { get; }
}
