using CsvHelper;
using SortRig.Planning.Assembly;
using SortRig.Planning.Cups;
using SortRig.Planning.PickLists;
using SortRig.Planning.Tests.Assembly;

namespace SortRig.Planning.Tests.PickLists;

public sealed class PickListTests
{
    [Fact]
    public void FromAssembly_ListsEveryPartOfEverySet_WithSlotAndOutputs()
    {
        var recipe = RandomInstances.Matched(3);
        var parts = RandomInstances.Parts(new Random(4), 8, [10e3, 20e3], 600e-6, 50e-6);
        var result = new SetAssembler().Assemble(recipe, parts);
        var list = PickListBuilder.FromAssembly(result);
        Assert.Equal(PickSource.Slots, list.Source);
        Assert.Equal(result.Sets.Count, list.Sets.Count);
        var picked = list.Sets.SelectMany(s => s.Items).Select(i => i.PartId!.Value).Concat(list.UnusedPartIds).Order();
        Assert.Equal(parts.Select(p => p.Id).Order(), picked);
        Assert.All(list.Sets.SelectMany(s => s.Items), i =>
            Assert.Equal(parts.Single(p => p.Id == i.PartId).Location, i.Source)
        );
    }

    [Fact]
    public void Csv_RoundTripsThroughCsvHelper()
    {
        var recipe = RandomInstances.Matched(0);
        var parts = RandomInstances.Parts(new Random(8), 8, [10e3], 300e-6, 20e-6);
        var list = PickListBuilder.FromAssembly(new SetAssembler().Assemble(recipe, parts));
        Assert.NotEmpty(list.Sets);
        var text = new StringWriter();
        PickListCsv.Write(text, list);

        using var reader = CsvReader.FromText(text.ToString(), null);
        var rows = new List<(string Set, string Part, string Value, string Outputs)>();
        while (reader.Read())
        {
            rows.Add(
                (
                    reader.GetString("set"),
                    reader.GetString("part"),
                    reader.GetString("value_ohm"),
                    reader.GetString("set_outputs")
                )
            );
        }

        Assert.Equal(PickListCsv.Columns, reader.Headers);
        var items = list
            .Sets.SelectMany(s => s.Items.Select(i => (s.Number.ToString(), i.PartId.ToString()!, i.Value!.Value)))
            .ToList();
        Assert.Equal(items.Count, rows.Count);
        Assert.All(items.Zip(rows), t =>
        {
            Assert.Equal((t.First.Item1, t.First.Item2), (t.Second.Set, t.Second.Part));
            Assert.Equal(
                t.First.Value,
                double.Parse(t.Second.Value, System.Globalization.CultureInfo.InvariantCulture)
            );
            Assert.StartsWith("ratio-match=", t.Second.Outputs, StringComparison.Ordinal);
        });
    }

    [Fact]
    public void FromCups_QuadTakesFourPerSetFromOneCup()
    {
        var recipe = RandomInstances.Matched(1);
        var counts = new List<CupCount>
        {
            new(10e3, "C", 2, false, 7, 0, 1000, 2),
            new(10e3, "D", 3, false, 3, 1000, 2000, 1),
            new(10e3, "R", 8, true, 5, double.NaN, double.NaN, 0),
        };
        var list = PickListBuilder.FromCups(recipe, counts);
        // Three positions per set: cup C (7 parts) gives two sets, cup D (3 parts) one.
        Assert.Equal(3, list.Sets.Count);
        Assert.Equal(["C", "C", "D"], list.Sets.Select(s => s.Items.Select(i => i.Source).Distinct().Single()).Order());
        Assert.All(list.Sets, s => Assert.Equal(1000, s.Outputs[0].WorstCaseError));
    }
}

public sealed class PickListCsvInjectionTests
{
    // CSV injection: a cell starting with =, +, -, @, tab or CR runs as a formula in a spreadsheet; a leading
    // apostrophe makes it text (OWASP "CSV Injection" advice, from memory). Numbers are not text and stay as written.
    [Theory]
    [InlineData("=HYPERLINK(\"http://example.invalid\",\"x\")")]
    [InlineData("+1+1")]
    [InlineData("-2+3")]
    [InlineData("@SUM(A1)")]
    [InlineData("\tcmd")]
    public void Write_FormulaLikeText_GetsApostrophe_NumbersUntouched(string hostile)
    {
        var item = new PickItem(hostile, "single", 7, hostile, 10_000, 9_996.5);
        var set = new PickSet(1, [item], [], -0.25);
        var list = new PickList("quad", PickSource.Slots, [set], []);
        var text = new StringWriter();
        PickListCsv.Write(text, list);

        using var reader = CsvReader.FromText(text.ToString(), null);
        Assert.True(reader.Read());
        Assert.Equal("'" + hostile, reader.GetString("position"));
        Assert.Equal("'" + hostile, reader.GetString("source"));
        Assert.Equal("9996.5", reader.GetString("value_ohm"));
        Assert.Equal("-0.2500", reader.GetString("set_score"));
        Assert.Equal("7", reader.GetString("part"));
    }
}
