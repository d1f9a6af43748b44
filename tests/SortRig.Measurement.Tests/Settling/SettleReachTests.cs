using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

/// <summary>The settle rule's predicted floors, against figures derived by hand from <see cref="InventedMeter"/>.</summary>
public sealed class SettleReachTests
{
    [Fact]
    public void Predict_SpanMode_SemAndResidualFloorAsDerivedByHand()
    {
        // 100 k range at 1 NPLC: noise 0.6 ppm = 0.06 Ohm, step 1 ppm = 0.1 Ohm; sigma = sqrt(0.06² + 0.1²/12) =
        // 0.06658 Ohm (quantisation step/sqrt(12), GUM F.2.2.1); SEM of 8 = 0.02354 Ohm.
        // Span 4 s at 45 readings/s: 181 readings, Sxx = (1/45)² 181 (181² − 1)/12 = 244.0 s², SE(b) = 0.004262 Ohm/s;
        // t(179, 0.975) = 1.9734 (Student t table, from memory); lag (181 − 8)/45/2 = 1.922 s;
        // a = (sqrt(2/pi) + 1.9734) 0.004262 x 5 x exp(−1.922/5) = 0.04021 Ohm.
        var options = SettleOptions.Default with { SettlingSpan = TimeSpan.FromSeconds(4) };
        var reach = SettleReach.Predict(InventedMeter.R100k, InventedMeter.One, options);

        Assert.Equal(0.06658, reach.ReadingSigma, 5);
        Assert.Equal(0.02354, reach.Sem, 5);
        Assert.Equal(0.04021, reach.SlopeFloor, 4);
        Assert.Equal(reach.SlopeFloor, reach.Floor);
    }

    [Fact]
    public void Predict_WindowMode_ExcursionFloorOverSlopeFraction()
    {
        // Window of 8 at 45 readings/s: Sxx = (1/45)² 8 x 63/12 = 0.02074 s², SE(b) = 0.06658/0.1440 = 0.4623 Ohm/s;
        // excursion E|b| x 7/45 s = 0.7979 x 0.4623 x 0.15556 = 0.05738 Ohm; over SlopeFractionOfTarget 0.5: 0.1148 Ohm.
        var reach = SettleReach.Predict(InventedMeter.R100k, InventedMeter.One, SettleOptions.Default);

        Assert.Equal(0.1148, reach.SlopeFloor, 4);
    }
}
