namespace SortRig.Instruments.Profiles;

/// <summary>
/// The command templates of a meter family. Placeholders: {function} (the 2- or 4-wire function
/// mnemonic), {range} (ohms), {nplc}, {source} (trigger source), {channels} (comma list), {channel}.
/// </summary>
/// <param name="Function2Wire">Mnemonic filled into {function} for 2-wire resistance, e.g. "RES"; null when 2-wire is
/// unsupported.</param>
/// <param name="Function4Wire">Mnemonic for 4-wire resistance, e.g. "FRES"; null when 4-wire is unsupported.</param>
/// <param name="Configure">Selects the function and range, e.g. "CONF:{function} {range}".</param>
/// <param name="Range">Sets the range, e.g. "SENS:{function}:RANG {range}".</param>
/// <param name="RangeQuery">Reads the range back, e.g. "SENS:{function}:RANG?".</param>
/// <param name="Nplc">Sets the integration time; null when the meter has one fixed setting.</param>
/// <param name="NplcQuery">Reads the integration time back; null with <paramref name="Nplc"/>.</param>
/// <param name="TriggerSource">Sets the trigger source, e.g. "TRIG:SOUR {source}"; optional.</param>
/// <param name="Read">Triggers and returns one reading, e.g. "READ?".</param>
/// <param name="Init">Arms the trigger, e.g. "INIT"; optional, paired with <paramref name="Fetch"/>.</param>
/// <param name="Fetch">Returns the armed reading, e.g. "FETC?"; optional.</param>
/// <param name="ScannerClose">Closes scanner channels, e.g. "ROUT:CLOS (@{channels})"; optional.</param>
/// <param name="ScannerOpen">Opens scanner channels; optional.</param>
/// <param name="ScannerScan">Sets a scan list, e.g. "ROUT:SCAN (@{channels})"; optional.</param>
/// <param name="TemperatureChannel">Reads a temperature channel in degC, e.g. "MEAS:TEMP? (@{channel})";
/// optional.</param>
public sealed record MeterCommands(
    string? Function2Wire,
    string? Function4Wire,
    CommandTemplate Configure,
    CommandTemplate Range,
    CommandTemplate RangeQuery,
    CommandTemplate? Nplc,
    CommandTemplate? NplcQuery,
    CommandTemplate? TriggerSource,
    CommandTemplate Read,
    CommandTemplate? Init,
    CommandTemplate? Fetch,
    CommandTemplate? ScannerClose,
    CommandTemplate? ScannerOpen,
    CommandTemplate? ScannerScan,
    CommandTemplate? TemperatureChannel
);
