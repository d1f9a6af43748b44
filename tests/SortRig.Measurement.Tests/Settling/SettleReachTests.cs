using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

/// <summary>The settle rule's predicted floors, against figures derived by hand from <see
/// cref="InventedMeter"/>.</summary>
public sealed class SettleReachTests
{
    [Fact]
    public void Predict_SpanMode_SemAndResidualFloorAsDerivedByHand()
    {
        // 100 k range at 1 NPLC: noise 0.7 ppm = 0.07 Ohm, step 1 ppm = 0.1 Ohm; sigma = sqrt(0.07² + 0.1²/12) =
        // 0.07572 Ohm (quantisation step/sqrt(12), GUM F.2.2.1); SEM of 8 = 0.02677 Ohm.
        // Span 4 s at 24 readings/s: 97 readings, Sxx = (1/24)² 97 (97² − 1)/12 = 132.03 s², SE(b) = 0.006590 Ohm/s;
        // t(95, 0.975) = 1.9853 (Student t table, 95 degrees of freedom, from memory: 1.985; 1.98525 by bisection on
        // the t distribution function, regularized incomplete beta, textbook identity); lag (97 − 8)/24/2 = 1.854 s;
        // a = (sqrt(2/pi) + 1.9853) 0.006590 x 5 x exp(−1.854/5) = 0.06329 Ohm.
        var options = SettleOptions.Default with { SettlingSpan = TimeSpan.FromSeconds(4) };
        var reach = SettleReach.Predict(InventedMeter.R100k, InventedMeter.One, options);

        Assert.Equal(0.07572, reach.ReadingSigma, 5);
        Assert.Equal(0.02677, reach.Sem, 5);
        Assert.Equal(0.06329, reach.SlopeFloor, 4);
        Assert.Equal(reach.SlopeFloor, reach.Floor);
    }

    [Fact]
    public void Predict_WindowMode_ExcursionFloorOverSlopeFraction()
    {
        // Window of 8 at 24 readings/s: Sxx = (1/24)² 8 x 63/12 = 0.07292 s², SE(b) = 0.07572/0.2700 = 0.2804 Ohm/s;
        // excursion E|b| x 7/24 s = 0.7979 x 0.2804 x 0.29167 = 0.06526 Ohm; over SlopeFractionOfTarget 0.5: 0.1305
        // Ohm.
        var reach = SettleReach.Predict(InventedMeter.R100k, InventedMeter.One, SettleOptions.Default);

        Assert.Equal(0.1305, reach.SlopeFloor, 4);
    }
}
