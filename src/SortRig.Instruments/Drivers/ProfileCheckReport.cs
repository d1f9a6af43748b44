using SortRig.Instruments.Scpi;

namespace SortRig.Instruments.Drivers;

/// <summary>How one profile check came out.</summary>
public enum CheckOutcome
{
    /// <summary>The meter did what the profile says.</summary>
    Pass = 0,

    /// <summary>The meter refused, answered wrongly or reported an error.</summary>
    Fail = 1,

    /// <summary>Not tried: the profile has no such command, or the session broke earlier.</summary>
    Skipped = 2,
}

/// <summary>One row of a profile check.</summary>
/// <param name="Check">What was tried, e.g. "range 10000 ohm".</param>
/// <param name="Outcome">Pass, fail or skipped.</param>
/// <param name="Detail">What the meter answered, or why it failed.</param>
public sealed record ProfileCheckRow(string Check, CheckOutcome Outcome, string Detail);

/// <summary>The outcome of checking a meter against a profile.</summary>
/// <param name="Family">The profile's family.</param>
/// <param name="Endpoint">What the session was connected to.</param>
/// <param name="Identity">The *IDN? answer, or null when it failed.</param>
/// <param name="Rows">The checks in the order they ran.</param>
public sealed record ProfileCheckReport(
    string Family,
    string Endpoint,
    InstrumentIdentity? Identity,
    IReadOnlyList<ProfileCheckRow> Rows
)
{
    /// <summary>True when no row failed.</summary>
    public bool Passed => Rows.All(r => r.Outcome != CheckOutcome.Fail);
}
