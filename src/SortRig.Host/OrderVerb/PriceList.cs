using System.Globalization;
using SortRig.Host.Cli;
using SortRig.Host.VerbSupport;
using SortRig.Planning.Ordering;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace SortRig.Host.OrderVerb;

/// <summary>
/// Unit prices by quantity break: a small YAML map of nominal (or "default") to a map of quantity to unit price, e.g.
/// <c>10k: { 1: 0.10, 100: 0.05 }</c>, and/or one list for every nominal on the command line ("1:0.10,100:0.05").
/// </summary>
internal static class PriceList
{
    /// <summary>Largest price file read.</summary>
    public const long MaxFileBytes = 64 * 1024;

    public static async Task<IReadOnlyDictionary<double, PriceBreaks>> LoadAsync(
        string? file,
        string? inline,
        IEnumerable<double> nominals,
        CancellationToken cancellationToken
    )
    {
        var byNominal = new Dictionary<double, PriceBreaks>();
        PriceBreaks? fallback = inline is null ? null : ParseInline(inline);
        if (file is not null)
        {
            var info = new FileInfo(file);
            if (!info.Exists)
            {
                throw new VerbException($"--prices: no file '{file}'");
            }

            if (info.Length > MaxFileBytes)
            {
                throw new VerbException($"--prices: '{file}' is larger than {MaxFileBytes / 1024} KiB");
            }

            var text = await File.ReadAllTextAsync(file, cancellationToken).ConfigureAwait(false);
            foreach (var (key, breaks) in ParseFile(text, file))
            {
                if (key == "default")
                {
                    fallback ??= breaks;
                }
                else
                {
                    byNominal[key == "default" ? 0 : Ohms(key, file)] = breaks;
                }
            }
        }

        var result = new Dictionary<double, PriceBreaks>();
        foreach (var nominal in nominals)
        {
            var own = byNominal.FirstOrDefault(kv => Math.Abs(kv.Key - nominal) <= nominal * 1e-6).Value;
            if ((own ?? fallback) is { } p)
            {
                result[nominal] = p;
            }
        }

        return result;
    }

    public static PriceBreaks ParseInline(string text)
    {
        var breaks = new List<PriceBreak>();
        foreach (var item in text.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
        {
            var parts = item.Split(':', StringSplitOptions.TrimEntries);
            if (
                parts.Length != 2
                || !int.TryParse(parts[0], NumberStyles.None, CultureInfo.InvariantCulture, out var q)
                || !double.TryParse(parts[1], NumberStyles.Float, CultureInfo.InvariantCulture, out var price)
            )
            {
                throw new VerbException($"--price: '{item}' is not QUANTITY:UNIT-PRICE (e.g. 1:0.10,100:0.05)");
            }

            breaks.Add(new PriceBreak(q, price));
        }

        return Breaks(breaks, "--price");
    }

    private static IEnumerable<(string Key, PriceBreaks Breaks)> ParseFile(string text, string file)
    {
        var stream = new YamlStream();
        try
        {
            stream.Load(new StringReader(text));
        }
        catch (YamlException e)
        {
            throw new VerbException($"--prices: {file}:{e.Start.Line}:{e.Start.Column}: not valid YAML ({e.Message})");
        }

        if (stream.Documents.Count != 1 || stream.Documents[0].RootNode is not YamlMappingNode root)
        {
            throw new VerbException(
                $"--prices: {file}: expected a map of nominal (e.g. 10k, or default) to quantity breaks"
            );
        }

        foreach (var (k, v) in root.Children)
        {
            var key = (k as YamlScalarNode)?.Value ?? "";
            if (v is not YamlMappingNode map)
            {
                throw new VerbException(
                    $"--prices: {file}:{k.Start.Line}:{k.Start.Column}: {key}: expected a map of quantity to unit "
                        + $"price, e.g. {{ 1: 0.10, 100: 0.05 }}"
                );
            }

            var breaks = new List<PriceBreak>();
            foreach (var (q, p) in map.Children)
            {
                var qText = (q as YamlScalarNode)?.Value;
                var pText = (p as YamlScalarNode)?.Value;
                if (
                    !int.TryParse(qText, NumberStyles.None, CultureInfo.InvariantCulture, out var quantity)
                    || !double.TryParse(pText, NumberStyles.Float, CultureInfo.InvariantCulture, out var price)
                )
                {
                    throw new VerbException(
                        $"--prices: {file}:{q.Start.Line}:{q.Start.Column}: {key}.{qText}: expected a whole quantity "
                            + $"and a unit price number"
                    );
                }

                breaks.Add(new PriceBreak(quantity, price));
            }

            yield return (key, Breaks(breaks, $"--prices: {file}: {key}"));
        }
    }

    private static PriceBreaks Breaks(List<PriceBreak> breaks, string where)
    {
        try
        {
            return new PriceBreaks(breaks);
        }
        catch (ArgumentException e)
        {
            throw new VerbException($"{where}: {e.Message.Split(" (Parameter", 2)[0]}");
        }
    }

    private static double Ohms(string key, string file) =>
        TradeValueParser.TryOhms(key, out var ohms)
            ? ohms
            : throw new VerbException($"--prices: {file}: '{key}' is not a nominal (e.g. 10k, 4.99k) nor 'default'");
}
