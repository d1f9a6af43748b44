namespace SortRig.Instruments.Drivers;

/// <summary>
/// The meter is not in the state the profile or the request says: a setting read back differs,
/// the *IDN? model does not match the profile, or the resource's transport is not allowed.
/// </summary>
public sealed class InstrumentSetupException : InstrumentException
{
    /// <summary>Creates the exception; the message reads "SETTING: meter has ACTUAL, expected EXPECTED".</summary>
    public InstrumentSetupException(string setting, string expected, string actual)
        : base($"{setting}: meter has {actual}, expected {expected}")
    {
        Setting = setting;
        Expected = expected;
        Actual = actual;
    }

    /// <summary>Which setting, e.g. "range", "nplc", "model", "transport".</summary>
    public string Setting { get; }

    /// <summary>What was expected.</summary>
    public string Expected { get; }

    /// <summary>What the meter has.</summary>
    public string Actual { get; }
}
