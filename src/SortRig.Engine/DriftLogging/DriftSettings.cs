using SortRig.Instruments.Drivers;

namespace SortRig.Engine.DriftLogging;

/// <summary>Validated, immutable drift-log settings (made by <see cref="DriftOptions.Validate"/>).</summary>
/// <param name="Resource">Meter resource, or null for the embedded simulator.</param>
/// <param name="Profile">Meter profile name or file.</param>
/// <param name="Database">Storage connection string.</param>
/// <param name="RunName">Drift run name.</param>
/// <param name="Channels">Part channels, in scan order (stored channels 0..n-1).</param>
/// <param name="Pt100Channel">Pt100 channel (stored as channel n), or null for no temperature.</param>
/// <param name="Interval">Time between scan starts.</param>
/// <param name="Duration">Run length, or null to log until stopped.</param>
/// <param name="Setup">Range, NPLC and wiring for every channel.</param>
/// <param name="BatchSize">Most samples per storage transaction.</param>
/// <param name="Notes">Free text stored with the run.</param>
/// <param name="Seed">Simulator seed.</param>
/// <param name="Speed">Simulator speed-up; 0 = pure virtual time.</param>
public sealed record DriftSettings(
    string? Resource,
    string Profile,
    string Database,
    string RunName,
    IReadOnlyList<int> Channels,
    int? Pt100Channel,
    TimeSpan Interval,
    TimeSpan? Duration,
    ResistanceSetup Setup,
    int BatchSize,
    string? Notes,
    int Seed,
    double Speed
)
{
    /// <summary>Library part id by part channel (stored as the channel's part); channels not in it hold no library
    /// part. Default none.</summary>
    public IReadOnlyDictionary<int, long> LibraryParts { get; init; } = new Dictionary<int, long>();

    /// <summary>Prefix of a part channel's stored label ("ch101").</summary>
    public const string PartLabelPrefix = "ch";

    /// <summary>Prefix of the thermometer channel's stored label ("pt100@105").</summary>
    public const string Pt100LabelPrefix = "pt100@";

    /// <summary>Stored label of a part channel.</summary>
    public static string PartLabel(int channel) => $"{PartLabelPrefix}{channel}";

    /// <summary>Stored label of the Pt100 channel.</summary>
    public static string Pt100Label(int channel) => $"{Pt100LabelPrefix}{channel}";

    /// <summary>True when a stored label names the thermometer channel.</summary>
    public static bool IsPt100Label(string label) => label.StartsWith(Pt100LabelPrefix, StringComparison.Ordinal);

    /// <summary>Scanner channels read in one scan: the Pt100 first and last (bracketing the parts), the parts
    /// between.</summary>
    public IReadOnlyList<int> ScanOrder => Pt100Channel is { } pt ? [pt, .. Channels, pt] : Channels;
}
