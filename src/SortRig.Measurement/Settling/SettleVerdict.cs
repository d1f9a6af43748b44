using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Settling;

/// <summary>What a live view shows after each reading. Statistics are null until the window has 3 readings.</summary>
/// <param name="Time">Time of the reading just added.</param>
/// <param name="LatestValue">Latest finite reading, ohms; null when none since insertion.</param>
/// <param name="SlopePpmPerSecond">Regression slope over the window, ppm of the mean per second.</param>
/// <param name="SemOhms">Standard error of the window mean, ohms.</param>
/// <param name="SemPpm">The same in ppm of the mean.</param>
/// <param name="TargetOhms">The target SEM in ohms at the current mean; null before any finite reading.</param>
/// <param name="Elapsed">Time since insertion (zero when empty).</param>
/// <param name="ReadingsCollected">Finite readings counted toward acceptance since the bounce or the last
/// flicker.</param>
/// <param name="Flickers">Overload flickers seen since insertion.</param>
public sealed record SettleLive(
    DateTimeOffset Time,
    double? LatestValue,
    double? SlopePpmPerSecond,
    double? SemOhms,
    double? SemPpm,
    double? TargetOhms,
    TimeSpan Elapsed,
    int ReadingsCollected,
    int Flickers
);

/// <summary>An accepted part.</summary>
/// <param name="Value">The window mean with its absolute and transfer uncertainties (k = 2).</param>
/// <param name="Readings">The window readings the value was computed from, oldest first.</param>
/// <param name="TimeToSettle">From insertion (first finite reading) to the accepting reading.</param>
/// <param name="ResidualHalfWidth">Half-width a of the residual-settling component included (rectangular) in the
/// uncertainties of <paramref name="Value"/>, ohms; 0 when <see cref="SettleOptions.AssumedTimeConstant"/> is
/// 0.</param>
/// <param name="AcceptedBy">The rule that accepted the part.</param>
/// <param name="Fit">The recovery fit when <paramref name="AcceptedBy"/> is Predictive: then <paramref name="Value"/>
/// is its predicted final value, with the fit's uncertainty added to the meter's terms; null otherwise.</param>
public sealed record SettleAcceptance(
    MeasuredValue Value,
    IReadOnlyList<Reading> Readings,
    TimeSpan TimeToSettle,
    double ResidualHalfWidth = 0,
    SettleRule AcceptedBy = SettleRule.Averaging,
    RecoveryFit? Fit = null
);

/// <summary>A part declared unstable.</summary>
/// <param name="Reason">Why.</param>
/// <param name="Elapsed">From insertion to the reading that passed the maximum settle time.</param>
public sealed record SettleFailure(UnstableReason Reason, TimeSpan Elapsed);

/// <summary>The settle rule's verdict after one reading.</summary>
/// <param name="State">The state the reading led to (Accepted, Unstable and Removed are reported once).</param>
/// <param name="Live">Figures for a live view.</param>
/// <param name="Acceptance">Set only when <paramref name="State"/> is Accepted.</param>
/// <param name="Failure">Set only when <paramref name="State"/> is Unstable.</param>
public sealed record SettleVerdict(
    SettleState State,
    SettleLive Live,
    SettleAcceptance? Acceptance = null,
    SettleFailure? Failure = null
);

/// <summary>The outcome of <see cref="SettleTracker.Run"/>.</summary>
/// <param name="Final">The Accepted or Unstable verdict, or the last verdict when the readings ran out first.</param>
/// <param name="ReadingsUsed">Readings consumed from the sequence, including ignored and overload ones.</param>
public sealed record SettleRun(SettleVerdict Final, int ReadingsUsed);
