using SortRig.Measurement.Settling;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

/// <summary>
/// The settle record of a part (schema version 3): which rule accepted it, and the predictive rule's fit, read back
/// exactly as committed. The fit figures are invented for the test (a 10 kOhm part cooling over a few seconds).
/// </summary>
public abstract partial class PrecisionLogContractTests
{
    private static RecoveryFit TwoPathFit =>
        new(
            RecoveryModel.TwoExponentials,
            10_000.412_345_678_9,
            0.001_234_5,
            0.000_456_7,
            [0.612_345, 2.718_281_828],
            37,
            4.25,
            0.000_311,
            -0.734,
            0.871
        );

    [SkippableFact]
    public async Task CommitPart_Predictive_ReadsBackRuleAndEveryFitFigure()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var commit = Bench.Part(session.Session.Id, batch, 10_000.41) with
        {
            AcceptedBy = SettleRule.Predictive,
            Fit = TwoPathFit,
        };

        var stored = await log.CommitPartAsync(commit, CancellationToken.None);
        var read = await log.GetPartAsync(stored.Id, CancellationToken.None);

        foreach (
            var part in new[]
            {
                stored,
                read!,
                (await log.GetPartsAsync(session.Session.Id, CancellationToken.None))[0],
            }
        )
        {
            Assert.Equal(SettleRule.Predictive, part.AcceptedBy);
            var fit = Assert.IsType<RecoveryFit>(part.Fit);
            // Doubles are stored as IEEE 754 binary64 on both engines (REAL, DOUBLE PRECISION): bit-exact round trip.
            Assert.Equal(TwoPathFit with { TimeConstantsSeconds = fit.TimeConstantsSeconds }, fit);
            Assert.Equal(TwoPathFit.TimeConstantsSeconds, fit.TimeConstantsSeconds);
            Assert.Equal(TwoPathFit.StandardUncertainty, fit.StandardUncertainty);
        }
    }

    [SkippableFact]
    public async Task CommitPart_OneExponentialWithRunsZNotFinite_ReadsBackOneTimeConstantAndNaN()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var oneFit = new RecoveryFit(
            RecoveryModel.OneExponential,
            10_000.2,
            0.002,
            0.001,
            [1.5],
            14,
            1.3,
            0.0004,
            double.NaN,
            0.64
        );
        var commit = Bench.Part(session.Session.Id, batch, 10_000.2) with
        {
            AcceptedBy = SettleRule.Predictive,
            Fit = oneFit,
        };

        var stored = await log.CommitPartAsync(commit, CancellationToken.None);

        var fit = Assert.IsType<RecoveryFit>(stored.Fit);
        Assert.Equal(RecoveryModel.OneExponential, fit.Model);
        Assert.Equal([1.5], fit.TimeConstantsSeconds);
        Assert.True(double.IsNaN(fit.RunsZ));
        Assert.Equal(14, fit.Readings);
    }

    [SkippableFact]
    public async Task CommitPart_AveragingAndUnstable_RecordTheRuleOrNothing_NoFit()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);

        var averaged = await log.CommitPartAsync(
            Bench.Part(session.Session.Id, batch, 10_000.3) with
            {
                AcceptedBy = SettleRule.Averaging,
            },
            CancellationToken.None
        );
        var unstable = await log.CommitPartAsync(
            Bench.Part(session.Session.Id, batch, 10_000.9, cup: null, index: 1) with
            {
                State = PartState.Unstable,
            },
            CancellationToken.None
        );

        Assert.Equal(SettleRule.Averaging, averaged.AcceptedBy);
        Assert.Null(averaged.Fit);
        Assert.Null(unstable.AcceptedBy);
        Assert.Null(unstable.Fit);
        Assert.True((await log.VerifyAsync(CancellationToken.None)).IsOk);
    }

    [SkippableFact]
    public async Task CommitPart_FitWithoutPredictiveOrWithWrongTimeConstants_RefusedAndNothingStored()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var part = Bench.Part(session.Session.Id, batch, 10_000.41);

        var averagedWithFit = await Assert.ThrowsAsync<ArgumentException>(() =>
            log.CommitPartAsync(
                part with
                {
                    AcceptedBy = SettleRule.Averaging,
                    Fit = TwoPathFit,
                },
                CancellationToken.None
            )
        );
        var oneTauForTwoPaths = await Assert.ThrowsAsync<ArgumentException>(() =>
            log.CommitPartAsync(
                part with
                {
                    AcceptedBy = SettleRule.Predictive,
                    Fit = TwoPathFit with { TimeConstantsSeconds = [0.6] },
                },
                CancellationToken.None
            )
        );
        var unstableWithRule = await Assert.ThrowsAsync<ArgumentException>(() =>
            log.CommitPartAsync(
                part with
                {
                    State = PartState.Unstable,
                    AcceptedBy = SettleRule.Averaging,
                },
                CancellationToken.None
            )
        );

        Assert.Contains("predictive", averagedWithFit.Message, StringComparison.Ordinal);
        Assert.Contains("TimeConstantsSeconds", oneTauForTwoPaths.Message, StringComparison.Ordinal);
        Assert.Contains("AcceptedBy", unstableWithRule.Message, StringComparison.Ordinal);
        Assert.Empty(await log.GetPartsAsync(session.Session.Id, CancellationToken.None));
    }

    [SkippableFact]
    public async Task Open_StoreAtVersionTwo_MigratesToThreeAndTakesFits()
    {
        // This build reads the version 3 columns with every part query, so the older store is left empty here.
        var old = await OpenWithMigrationsAsync([EngineMigrations[0], EngineMigrations[1]]);
        await old.DisposeAsync();
        long rowsBefore = await SchemaVersionRowsAsync();

        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var stored = await log.CommitPartAsync(
            Bench.Part(session.Session.Id, batch, 10_000.41) with
            {
                AcceptedBy = SettleRule.Predictive,
                Fit = TwoPathFit,
            },
            CancellationToken.None
        );

        Assert.Equal(2, rowsBefore);
        Assert.Equal(EngineMigrations.Count, (await log.VerifyAsync(CancellationToken.None)).SchemaVersion);
        Assert.Equal(SettleRule.Predictive, stored.AcceptedBy);
        Assert.Equal(TwoPathFit.FinalValue, stored.Fit!.FinalValue);
    }
}
