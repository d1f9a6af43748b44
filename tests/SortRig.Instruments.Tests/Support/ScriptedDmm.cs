using System.Collections.Concurrent;
using System.Globalization;
using System.Text.RegularExpressions;

namespace SortRig.Instruments.Tests.Support;

/// <summary>
/// A script for <see cref="ScriptedScpiPeer"/> that behaves like a small SCPI-99 DMM: keeps the
/// function, range and NPLC, answers read-backs in NR3, queues errors for SYST:ERR?, and
/// reports -113 "Undefined header" for commands it does not know. Overrides go first.
/// </summary>
internal sealed partial class ScriptedDmm
{
    private readonly ConcurrentQueue<string> _errors = new();
    private readonly Dictionary<string, double> _range = new() { ["RES"] = 1000, ["FRES"] = 1000 };
    private readonly Dictionary<string, double> _nplc = new() { ["RES"] = 10, ["FRES"] = 10 };

    public string Identity { get; set; } = "Bench Test Works,SIM-6H,SN0042,1.02";

    /// <summary>Per-command replies that replace the built-in behaviour (exact command text).</summary>
    public Dictionary<string, Func<PeerAction>> Overrides { get; } = new(StringComparer.Ordinal);

    /// <summary>Replies to READ?/FETC?, in turn; the last one repeats.</summary>
    public ConcurrentQueue<string> Readings { get; } = new();

    public string? ClosedChannel { get; private set; }

    public void QueueError(int code, string text) => _errors.Enqueue($"{code},\"{text}\"");

    /// <summary>Forgets range and NPLC, as *RST or a power cycle would.</summary>
    public void ResetToDefaults()
    {
        _range["RES"] = _range["FRES"] = 1000;
        _nplc["RES"] = _nplc["FRES"] = 10;
    }

    public PeerAction Handle(string line)
    {
        if (Overrides.TryGetValue(line, out var over))
        {
            return over();
        }

        var cmd = line.Trim().ToUpperInvariant();
        Match m;
        switch (cmd)
        {
            case "*IDN?":
                return PeerAction.Reply(Identity);
            case "*OPC?":
                return PeerAction.Reply("1");
            case "*ESR?":
                return PeerAction.Reply("0");
            case "*CLS":
                _errors.Clear();
                return PeerAction.Silent;
            case "*RST":
                ResetToDefaults();
                return PeerAction.Silent;
            case "TRIG:SOUR IMM" or "INIT":
                return PeerAction.Silent;
            case "SYST:ERR?":
                return PeerAction.Reply(_errors.TryDequeue(out var e) ? e : "+0,\"No error\"");
            case "READ?" or "FETC?":
                return PeerAction.Reply(NextReading());
        }

        if ((m = ConfPattern().Match(cmd)).Success)
        {
            _range[m.Groups[1].Value] = m.Groups[2].Success ? Parse(m.Groups[2].Value) : _range[m.Groups[1].Value];
            return PeerAction.Silent;
        }

        if ((m = SensPattern().Match(cmd)).Success)
        {
            var table = m.Groups[2].Value == "RANG" ? _range : _nplc;
            if (m.Groups[3].Value == "?")
            {
                return PeerAction.Reply(
                    table[m.Groups[1].Value].ToString("+0.00000000E+00;-0.00000000E+00", CultureInfo.InvariantCulture)
                );
            }

            table[m.Groups[1].Value] = Parse(m.Groups[4].Value);
            return PeerAction.Silent;
        }

        if ((m = RoutePattern().Match(cmd)).Success)
        {
            ClosedChannel = m.Groups[1].Value == "CLOS" ? m.Groups[2].Value : null;
            return PeerAction.Silent;
        }

        QueueError(-113, "Undefined header");
        return PeerAction.Silent;
    }

    private string NextReading() =>
        Readings.Count > 1 && Readings.TryDequeue(out var r) ? r
        : Readings.TryPeek(out var last) ? last
        : "+1.00012340E+03";

    private static double Parse(string s) => double.Parse(s, CultureInfo.InvariantCulture);

    [GeneratedRegex(@"^CONF:(RES|FRES)(?:\s+([-+0-9.E]+))?$")]
    private static partial Regex ConfPattern();

    [GeneratedRegex(@"^SENS:(RES|FRES):(RANG|NPLC)(\?|\s+([-+0-9.E]+))$")]
    private static partial Regex SensPattern();

    [GeneratedRegex(@"^ROUT:(CLOS|OPEN) \(@([0-9,:]+)\)$")]
    private static partial Regex RoutePattern();
}
