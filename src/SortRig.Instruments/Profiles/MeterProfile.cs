using System.Text.RegularExpressions;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Transports;
using SortRig.Measurement.Specs;

namespace SortRig.Instruments.Profiles;

/// <summary>How to reach a meter family.</summary>
/// <param name="Transports">Transports the family can be reached over.</param>
/// <param name="Terminator">Line terminator, "\n", "\r\n" or "\r".</param>
/// <param name="QueryTimeout">Reply timeout for ordinary queries (reads add the integration time).</param>
/// <param name="Serial">Default serial settings; null when the profile gives none (9600 8N1 then).</param>
public sealed record MeterComms(
    IReadOnlyList<TransportKind> Transports,
    string Terminator,
    TimeSpan QueryTimeout,
    SerialSettings? Serial
);

/// <summary>
/// One meter family loaded from instruments/*.yaml: identity match, comms, metrology and commands.
/// </summary>
/// <param name="Family">Generic family name, e.g. "bench-6half-lan".</param>
/// <param name="SourcePath">The file it was loaded from.</param>
/// <param name="ModelPattern">Matches the model field of the *IDN? reply.</param>
/// <param name="Comms">Transports, terminator, timeouts.</param>
/// <param name="TwoWire">True when the meter measures 2-wire resistance.</param>
/// <param name="Spec">The metrology (ranges, NPLC settings, 4-wire, settle time).</param>
/// <param name="Commands">The command templates.</param>
public sealed record MeterProfile(
    string Family,
    string SourcePath,
    Regex ModelPattern,
    MeterComms Comms,
    bool TwoWire,
    MeterSpec Spec,
    MeterCommands Commands
)
{
    /// <summary>True when <paramref name="model"/> (the *IDN? model field) belongs to this family.</summary>
    public bool MatchesModel(string model) => ModelPattern.IsMatch(model);

    /// <summary>The range whose full scale equals <paramref name="fullScale"/> within 1 ppm, or null.</summary>
    public RangeSpec? FindRange(double fullScale) => Spec.Ranges.FirstOrDefault(r => SameValue(r.FullScale, fullScale));

    /// <summary>The NPLC setting equal to <paramref name="nplc"/> within 1 ppm, or null.</summary>
    public NplcSpec? FindNplc(double nplc) => Spec.Nplcs.FirstOrDefault(n => SameValue(n.Nplc, nplc));

    /// <summary>True when two settings agree within 1 ppm (read-back values are rounded by the meter).</summary>
    public static bool SameValue(double a, double b) => Math.Abs(a - b) <= 1e-6 * Math.Max(Math.Abs(a), Math.Abs(b));
}
