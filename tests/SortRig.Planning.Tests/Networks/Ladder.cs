using SortRig.Planning.Networks;

namespace SortRig.Planning.Tests.Networks;

/// <summary>Voltage-mode R-2R ladder built in code: 2R termination at the LSB end, output at the MSB node.</summary>
internal static class Ladder
{
    public static Netlist Netlist(int bits)
    {
        var r = new List<NetResistor> { new("RT", "n0", "gnd") };
        for (var i = 0; i < bits; i++)
        {
            r.Add(new($"L{i}", $"n{i}", $"b{i}"));
            if (i > 0)
            {
                r.Add(new($"S{i}", $"n{i - 1}", $"n{i}"));
            }
        }

        var sources = Enumerable.Range(0, bits).Select(i => new NetSource($"B{i}", $"b{i}", "gnd", 0)).ToList();
        return new Netlist("gnd", r, sources, []);
    }

    public static Dictionary<string, double> Nominal(int bits) =>
        Netlist(bits).Resistors.ToDictionary(x => x.Name, x => x.Name.StartsWith('S') ? 10_000.0 : 20_000.0);
}
