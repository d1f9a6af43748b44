using SortRig.Instruments.Profiles;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>
/// What every profile the loader accepts must satisfy, whatever text it came from: the rules the
/// loader documents (docs/instruments.md), checked on the loaded record rather than on the text.
/// </summary>
internal static class AcceptedProfileRules
{
    public static void AssertHolds(MeterProfile p, string file)
    {
        Assert.Equal(file, p.SourcePath);
        Assert.Matches("^[a-z0-9][a-z0-9-]*$", p.Family);
        Assert.NotEmpty(p.Comms.Transports);
        Assert.Equal(p.Comms.Transports.Count, p.Comms.Transports.Distinct().Count());
        Assert.Contains(p.Comms.Terminator, new[] { "\n", "\r\n", "\r" });
        Assert.InRange(p.Comms.QueryTimeout.TotalSeconds, 0.01, 600);
        Assert.True(p.TwoWire || p.Spec.FourWire);
        Assert.InRange(p.Spec.RangeChangeSettle.TotalSeconds, 0, 60);

        Assert.NotEmpty(p.Spec.Ranges);
        for (var i = 0; i < p.Spec.Ranges.Count; i++)
        {
            var r = p.Spec.Ranges[i];
            Assert.InRange(r.FullScale, 1e-3, 1e12);
            Assert.True(i == 0 || r.FullScale > p.Spec.Ranges[i - 1].FullScale, $"ranges not ascending at {i}");
            Assert.InRange(r.OverRangeFactor, 1.0, 2.0);
            Assert.True(
                r.Accuracy24Hours.PercentOfReading <= r.Accuracy1Year.PercentOfReading
                    && r.Accuracy24Hours.PercentOfRange <= r.Accuracy1Year.PercentOfRange,
                $"range {i}: 24 h looser than 1 year"
            );
            Assert.InRange(r.TestCurrent, 0, 1);
        }

        Assert.NotEmpty(p.Spec.Nplcs);
        for (var i = 0; i < p.Spec.Nplcs.Count; i++)
        {
            Assert.InRange(p.Spec.Nplcs[i].Nplc, 1e-4, 1000);
            Assert.True(
                i == 0 || p.Spec.Nplcs[i].Nplc > p.Spec.Nplcs[i - 1].Nplc,
                $"NPLC settings not ascending at {i}"
            );
        }

        var c = p.Commands;
        Assert.Equal(p.TwoWire, c.Function2Wire is not null);
        Assert.Equal(p.Spec.FourWire, c.Function4Wire is not null);
        Assert.True(c.Read.IsQuery && c.RangeQuery.IsQuery && !c.Configure.IsQuery && !c.Range.IsQuery);
        Assert.Contains("range", c.Range.Placeholders);
        Assert.Equal(c.Init is null, c.Fetch is null);
        Assert.Equal(c.Nplc is null, c.NplcQuery is null);
        Assert.True(p.Spec.Nplcs.Count == 1 || c.Nplc is not null, "several NPLC settings but no nplc command");
    }
}
