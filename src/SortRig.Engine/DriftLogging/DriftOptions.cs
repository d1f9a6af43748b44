using SortRig.Instruments.Drivers;

namespace SortRig.Engine.DriftLogging;

/// <summary>
/// Settings of an overnight drift log, bound from the "Drift" configuration section (appsettings.json,
/// SORTRIG_Drift__* environment variables, command-line flags). <see cref="Validate"/> checks every
/// option, naming it and its valid range, and returns the immutable <see cref="DriftSettings"/>.
/// </summary>
public sealed class DriftOptions
{
    /// <summary>Configuration section name.</summary>
    public const string Section = "Drift";

    /// <summary>VISA-style resource of the meter; empty runs the embedded simulator with parts on the part channels.
    /// Default empty.</summary>
    public string Resource { get; set; } = "";

    /// <summary>Meter profile file or family name under instruments/; it must have scanner commands. Default
    /// "simulator".</summary>
    public string Profile { get; set; } = "simulator";

    /// <summary>Storage: SQLite file path or "Data Source=..."; or PostgreSQL "Host=...". Default sortrig.db.</summary>
    public string Database { get; set; } = "sortrig.db";

    /// <summary>Name of the drift run, 1..200 characters. Default "overnight".</summary>
    public string Run { get; set; } = "overnight";

    /// <summary>Scanner channels holding parts, e.g. "101-104,107"; 1..64 distinct channels 1..9999. Default
    /// "101-104".</summary>
    public string Channels { get; set; } = "101-104";

    /// <summary>
    /// Library parts on the part channels, "channel=part" items such as "101=17,102=#18,103-104=20-21" (a part id, the
    /// "#17" of its printed label, or a range onto a range of channels). Every channel must be in <see
    /// cref="Channels"/>, every part on one channel only; the parts must be in the library (checked before the run
    /// starts). Default none.
    /// </summary>
    public string? LibraryParts { get; set; }

    /// <summary>
    /// Scanner channel wired to a Pt100 (IEC 60751) for the temperature; 0 = no thermometer. Default (null): the
    /// channel after the highest part channel, 105 with the default channels (our own layout); 0..9999, not a part
    /// channel.
    /// </summary>
    public int? Pt100Channel { get; set; }

    /// <summary>Time between scans, seconds. Default 60; 1..86 400.</summary>
    public double IntervalSeconds { get; set; } = 60;

    /// <summary>Length of the run, hours; 0 logs until stopped. Default 12; 0..8760.</summary>
    public double Hours { get; set; } = 12;

    /// <summary>Range full scale in ohms used for every channel (the Pt100 included); must be a range of the profile.
    /// Default 10 000.</summary>
    public double Range { get; set; } = 10_000;

    /// <summary>Integration time in power-line cycles; must be a setting of the profile. Default 10.</summary>
    public double Nplc { get; set; } = 10;

    /// <summary>Measure 4-wire (recommended for drift). Default true.</summary>
    public bool FourWire { get; set; } = true;

    /// <summary>Samples per storage transaction at most (fewer when the log keeps up). Default 64; 1..5000.</summary>
    public int BatchSize { get; set; } = 64;

    /// <summary>Free text stored with the run. Default none.</summary>
    public string? Notes { get; set; }

    /// <summary>Simulator only: random seed of the parts and the room. Default 2026.</summary>
    public int Seed { get; set; } = 2026;

    /// <summary>Simulator only: virtual time runs this many times faster than the wall clock. Default 1; 1..10
    /// 000.</summary>
    public double Speed { get; set; } = 1;

    /// <summary>Simulator only: run in pure virtual time, as fast as the machine allows (overrides Speed). Default
    /// false.</summary>
    public bool Virtual { get; set; }

    /// <summary>Checks every option; throws <see cref="ArgumentException"/> naming the first bad one and its valid
    /// range.</summary>
    public DriftSettings Validate()
    {
        var channels = ChannelListParser.Parse(Channels, "Drift.Channels");
        Require(!string.IsNullOrWhiteSpace(Run) && Run.Length <= 200, "Drift.Run", "1 to 200 characters", Run);

        // Names and notes end up in logs, reports and on the terminal: no control characters (a newline forges a log
        // line).
        Require(!Run.Any(char.IsControl), "Drift.Run", "plain text without control characters", Printable(Run));
        Require(
            Notes is null || !Notes.Any(char.IsControl),
            "Drift.Notes",
            "plain text without control characters",
            Printable(Notes)
        );
        Require(
            !string.IsNullOrWhiteSpace(Database),
            "Drift.Database",
            "a SQLite path or a connection string",
            Database
        );
        try
        {
            Storage.PrecisionLogFactory.CheckTarget(Database);
        }
        catch (ArgumentException e)
        {
            throw new ArgumentException($"Drift.Database: {e.Message}", "Drift.Database", e);
        }
        catch (Storage.Contracts.StorageException e) when (e.Fault == Storage.Contracts.StorageFault.Unavailable)
        {
            throw new ArgumentException($"Drift.Database: {e.Message}", "Drift.Database", e);
        }

        Require(!string.IsNullOrWhiteSpace(Profile), "Drift.Profile", "a profile name or YAML file", Profile);
        var pt100 = Pt100Channel ?? (channels.Max() + 1);
        Require(
            pt100 is >= 0 and <= 9999 && !channels.Contains(pt100),
            "Drift.Pt100Channel",
            "0 (none) or 1 to 9999 and not a part channel",
            pt100
        );
        Require(IntervalSeconds is >= 1 and <= 86_400, "Drift.IntervalSeconds", "1 to 86400 s", IntervalSeconds);
        Require(Hours is >= 0 and <= 8760, "Drift.Hours", "0 (until stopped) to 8760 h", Hours);
        Require(double.IsFinite(Range) && Range > 0, "Drift.Range", "a range full scale > 0 ohm", Range);
        Require(double.IsFinite(Nplc) && Nplc > 0, "Drift.Nplc", "an NPLC setting > 0", Nplc);
        Require(BatchSize is >= 1 and <= 5000, "Drift.BatchSize", "1 to 5000 samples", BatchSize);
        Require(Speed is >= 1 and <= 10_000, "Drift.Speed", "1 to 10000", Speed);
        var simulated = string.IsNullOrWhiteSpace(Resource);
        Require(
            simulated || (Speed == 1 && !Virtual),
            "Drift.Speed",
            "1 with a real meter (--speed and --virtual apply to the simulator only)",
            Speed
        );
        var interval = TimeSpan.FromSeconds(IntervalSeconds);
        var duration = Hours == 0 ? (TimeSpan?)null : TimeSpan.FromHours(Hours);
        Require(duration is null || duration >= interval, "Drift.Hours", "0 or at least one interval", Hours);
        return new DriftSettings(
            simulated ? null : Resource.Trim(),
            Profile,
            Database,
            Run,
            channels,
            pt100 == 0 ? null : pt100,
            interval,
            duration,
            new ResistanceSetup(Range, Nplc, FourWire),
            BatchSize,
            Notes,
            Seed,
            Virtual ? 0 : Speed
        )
        {
            LibraryParts = LibraryPartMap.Parse(LibraryParts, channels),
        };
    }

    private static string Printable(string? text) =>
        string.Concat(
            (text ?? "").Select(c =>
                char.IsControl(c)
                    ? string.Create(System.Globalization.CultureInfo.InvariantCulture, $"U+{(int)c:X4}")
                    : c.ToString()
            )
        );

    private static void Require(bool ok, string option, string valid, object? was)
    {
        if (!ok)
        {
            throw new ArgumentException($"{option} must be {valid}; was '{was}'.", option);
        }
    }
}
