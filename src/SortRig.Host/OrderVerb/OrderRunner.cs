using SortRig.Host.PlanVerb;
using SortRig.Host.VerbSupport;
using SortRig.Planning.Assembly;
using SortRig.Planning.Ordering;
using SortRig.Planning.Recipes;
using SortRig.Reporting.Plots;
using Spectre.Console;

namespace SortRig.Host.OrderVerb;

/// <summary>Loads the recipe, stock, uncertainty and prices, runs the estimate, prints the table and writes CSV and
/// PNG.</summary>
internal static class OrderRunner
{
    public static Task<int> RunAsync(OrderRequest request, IAnsiConsole console, CancellationToken cancellationToken) =>
        VerbGuard.RunAsync(console, async () =>
        {
            if (request.Sets < 1)
            {
                throw new VerbException($"--sets: {request.Sets} sets is nothing to order for (give 1 to 10 000)");
            }

            var recipe = await RecipeLoader
                .LoadFileAsync(PlanRunner.RecipePath(request.Recipe), cancellationToken)
                .ConfigureAwait(false);
            var (stock, stockSource) = await StockSource.LoadAsync(request, cancellationToken).ConfigureAwait(false);
            var (uncertainty, uSource) = StockSource.Uncertainty(request, recipe, stock.Tolerance);
            var prices = await PriceList
                .LoadAsync(request.PricesFile, request.Price, recipe.SinglePartDemand.Keys, cancellationToken)
                .ConfigureAwait(false);
            var assembly = request.TimeLimit is { } limit ? new AssemblyOptions(timeLimit: limit) : null;
            var options = new OrderOptions(
                request.Sets,
                stock,
                uncertainty,
                request.Trials,
                request.Seed,
                request.MaxParts,
                prices: prices,
                assembly: assembly,
                progress: new OrderProgressView(console),
                perNominal: request.PerNominal
            );
            var estimate = await Task.Run(
                    () => new OrderEstimator().Estimate(recipe, options, cancellationToken),
                    cancellationToken
                )
                .ConfigureAwait(false);
            OrderView.Write(console, estimate, stockSource, uSource, request.TimeLimit is null);
            if (request.CsvPath is { } csv)
            {
                await using (var file = new StreamWriter(csv, append: false))
                {
                    OrderCsv.WriteOrder(file, estimate);
                }

                console.MarkupLine(Markup.Escape($"order written to {csv}"));
            }

            if (request.CurveCsvPath is { } curveCsv)
            {
                await using (var file = new StreamWriter(curveCsv, append: false))
                {
                    OrderCsv.WriteCurve(file, estimate);
                }

                console.MarkupLine(Markup.Escape($"curve written to {curveCsv}"));
            }

            if (request.PlotPath is { } noPlot && estimate.Curve.Count < 2)
            {
                console.MarkupLine(
                    Markup.Escape($"no plot written to {noPlot}: --max-parts leaves room for one order size only")
                );
            }
            else if (request.PlotPath is { } png)
            {
                var input = new OrderCurveInput(
                    estimate.RecipeName,
                    estimate.SetsWanted,
                    [.. estimate.Curve.Select(c => (double)c.PartsBought)],
                    [.. estimate.Curve.Select(c => (double)c.Median)],
                    [.. estimate.Curve.Select(c => (double)c.Low)],
                    [.. estimate.Curve.Select(c => (double)c.High)],
                    [
                        .. estimate
                            .Levels.Where(l => l.SetEquivalents is not null)
                            .GroupBy(l => l.TotalParts)
                            .Select(g =>
                                (string.Join(" / ", g.Select(l => OrderView.Percent(l.Confidence))), (double)g.Key)
                            ),
                    ]
                );
                await File.WriteAllBytesAsync(
                        png,
                        OrderCurvePlot.Render(input, PlotSize.Default).Png,
                        cancellationToken
                    )
                    .ConfigureAwait(false);
                console.MarkupLine(Markup.Escape($"plot written to {png}"));
            }

            return VerbExit.Ok;
        });
}
