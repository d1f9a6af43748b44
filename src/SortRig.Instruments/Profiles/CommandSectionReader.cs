namespace SortRig.Instruments.Profiles;

/// <summary>Reads the "commands" mapping, checking presence, placeholders and query form of each template.</summary>
internal static class CommandSectionReader
{
    private static readonly Rule[] s_rules =
    [
        new("configure", Need.Always, [], ["function", "range"], Query: false),
        new("range", Need.Always, ["range"], ["function"], Query: false),
        new("range_query", Need.Always, [], ["function"], Query: true),
        new("nplc", Need.WhenSeveralNplc, ["nplc"], ["function"], Query: false),
        new("nplc_query", Need.WhenSeveralNplc, [], ["function"], Query: true),
        new("trigger_source", Need.Optional, ["source"], [], Query: false),
        new("read", Need.Always, [], [], Query: true),
        new("init", Need.Optional, [], [], Query: false),
        new("fetch", Need.Optional, [], [], Query: true),
        new("scanner_close", Need.Optional, ["channels"], [], Query: false),
        new("scanner_open", Need.Optional, ["channels"], [], Query: false),
        new("scanner_scan", Need.Optional, ["channels"], [], Query: false),
        new("temperature_channel", Need.Optional, ["channel"], [], Query: true),
    ];

    private static readonly string[] s_keys = ["function_2wire", "function_4wire", .. s_rules.Select(r => r.Key)];

    private enum Need
    {
        Always,
        Optional,
        WhenSeveralNplc,
    }

    public static MeterCommands Read(YamlField field, bool twoWire, bool fourWire, int nplcCount)
    {
        var map = field.AsMap(s_keys);
        var t = new Dictionary<string, CommandTemplate>(StringComparer.Ordinal);
        foreach (var rule in s_rules)
        {
            var node =
                rule.Need == Need.Always || (rule.Need == Need.WhenSeveralNplc && nplcCount > 1)
                    ? map.Required(rule.Key, $"a command template ({rule.Describe()})")
                    : map.Optional(rule.Key);
            if (node is { } present)
            {
                t[rule.Key] = rule.Check(present);
            }
        }

        Pair(map, t, "nplc", "nplc_query");
        Pair(map, t, "init", "fetch");
        return new MeterCommands(
            Function(map, "function_2wire", twoWire, "two_wire"),
            Function(map, "function_4wire", fourWire, "four_wire"),
            t["configure"],
            t["range"],
            t["range_query"],
            t.GetValueOrDefault("nplc"),
            t.GetValueOrDefault("nplc_query"),
            t.GetValueOrDefault("trigger_source"),
            t["read"],
            t.GetValueOrDefault("init"),
            t.GetValueOrDefault("fetch"),
            t.GetValueOrDefault("scanner_close"),
            t.GetValueOrDefault("scanner_open"),
            t.GetValueOrDefault("scanner_scan"),
            t.GetValueOrDefault("temperature_channel")
        );
    }

    private static string? Function(YamlMap map, string key, bool supported, string wiringKey)
    {
        if (!supported)
        {
            return map.Optional(key) is { } given
                ? throw given.Error($"is given but wiring.{wiringKey} is false", $"no {key}")
                : null;
        }

        var field = map.Required(
            key,
            $"the function mnemonic filled into {{function}}, e.g. RES (wiring.{wiringKey} is true)"
        );
        var value = field.AsString();
        return value.All(c => char.IsAsciiLetterOrDigit(c) || c is ':' or '_')
            ? value
            : throw field.Error($"'{value}' is not a SCPI mnemonic", "letters, digits and ':' only");
    }

    private static void Pair(YamlMap map, Dictionary<string, CommandTemplate> t, string first, string second)
    {
        if (t.ContainsKey(first) != t.ContainsKey(second))
        {
            var (given, missing) = t.ContainsKey(first) ? (first, second) : (second, first);
            throw map.Optional(given)!
                .Value.Error($"is given without {missing}", $"both {first} and {second}, or neither");
        }
    }

    private sealed record Rule(string Key, Need Need, string[] Required, string[] Allowed, bool Query)
    {
        public string Describe() =>
            (Query ? "a query" : "a command")
            + (Required.Length > 0 ? " using " + string.Join(", ", Required.Select(p => $"{{{p}}}")) : string.Empty);

        public CommandTemplate Check(YamlField field)
        {
            var template = new CommandTemplate(field.AsString());
            foreach (var p in template.Placeholders.Where(p => !Required.Contains(p) && !Allowed.Contains(p)))
            {
                var allowed = Required.Concat(Allowed).Select(a => $"{{{a}}}").ToList();
                throw field.Error(
                    $"uses unknown placeholder {{{p}}}",
                    allowed.Count == 0 ? "no placeholders" : $"only {string.Join(", ", allowed)}"
                );
            }

            foreach (var p in Required.Where(p => !template.Placeholders.Contains(p)))
            {
                throw field.Error($"does not use {{{p}}}", Describe());
            }

            return template.IsQuery == Query
                ? template
                : throw field.Error(Query ? "is not a query (no '?')" : "is a query (has '?')", Describe());
        }
    }
}
