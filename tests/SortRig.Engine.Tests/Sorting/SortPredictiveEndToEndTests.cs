using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Engine.Announcing;
using SortRig.Engine.Composition;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Settling;
using SortRig.Simulator;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Sorting;

/// <summary>
/// Sorting with the predictive settle rule chosen (--settle predictive) end to end: the embedded simulator on a real
/// TCP socket (its simple physics, on which docs/bench-settle.md found the rule clean), the SQLite log and the cup
/// assigner. The simulator's truth (its side channel) is the outside reference the cups are checked against.
/// </summary>
public sealed class SortPredictiveEndToEndTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-e2e-predictive-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Sort_PredictiveRule_LogsTheRuleForEveryPart_AndEveryPartInItsTrueCup()
    {
        const int parts = 24;
        var options = new SortOptions
        {
            Database = Path.Combine(_dir, "predictive.db"),
            Session = "e2e-predictive",
            Settle = SettleRule.Predictive,
            Parts = parts,
            Seed = 5150,
            Speed = 30,
            Speech = false,
            Live = false,
        };
        var time = new ScaledTimeProvider(options.Speed);
        var snapshot = new BenchSnapshot();
        var services = new SortServices(time, new BenchEventHub(time), snapshot, new OperatorCommands(),
            new PlainTextAnnouncer(new StringWriter()), NullLoggerFactory.Instance);
        SimulatedBench? bench = null;
        using var timeout = new CancellationTokenSource(TimeSpan.FromMinutes(4));

        var outcome = await SortRunner.RunAsync(options, services, b => bench = b, timeout.Token);

        Assert.Equal(parts, outcome.PartsRecorded);
        await using var log = await PrecisionLogFactory.OpenAsync(options.Database, null, default);
        var stored = await log.GetPartsAsync(outcome.SessionId, default);
        Assert.All(stored, p => Assert.Equal(PartState.Announced, p.State));

        // Every part says which rule accepted it; a predictive acceptance carries its fit, an averaging one none.
        Assert.All(stored, p => Assert.NotNull(p.AcceptedBy));
        Assert.All(stored.Where(p => p.AcceptedBy == SettleRule.Predictive), p =>
        {
            var fit = Assert.IsType<RecoveryFit>(p.Fit);
            Assert.Equal((int)fit.Model, fit.TimeConstantsSeconds.Count);
            Assert.True(fit.StandardUncertainty > 0, $"part {p.Number}: fit uncertainty {fit.StandardUncertainty}");
        });
        Assert.All(stored.Where(p => p.AcceptedBy == SettleRule.Averaging), p => Assert.Null(p.Fit));
        // The rule was really on: on the simple bench it accepts most parts before the averaging rule does.
        Assert.Contains(stored, p => p.AcceptedBy == SettleRule.Predictive);
        Assert.Equal(stored.Select(p => p.AcceptedBy?.ToString()), snapshot.Parts().OrderBy(v => v.Number).Select(v => v.AcceptedBy));

        // Simulator truth (its side channel) is the outside reference: each value within its stated U (k = 2), each
        // part in the cup its true value calls for unless a band edge lies within that U.
        var (misplaced, excused) = TruthCheck.Compare(options, stored, number => bench!.Truth(number - 1));
        Assert.Empty(misplaced);
        Assert.True(excused <= parts / 8, $"{excused} parts sat on a band edge");
    }
}
