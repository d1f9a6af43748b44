namespace SortRig.Engine.Checking;

/// <summary>The last check as the console view and the bench page show it.</summary>
/// <param name="Name">The check's name in the log.</param>
/// <param name="Seq">Check number in the session.</param>
/// <param name="At">When it was read.</param>
/// <param name="ValueOhms">The value on the session's scale, ohms.</param>
/// <param name="SigmaScore">(value - centre) / sigma; 0 while the baseline is being read.</param>
/// <param name="InControl">The chart's verdict.</param>
/// <param name="Reason">Why it is out of control (or what happened), else empty.</param>
/// <param name="Flagged">Parts waiting to be measured again.</param>
/// <param name="GainPpm">The meter's apparent gain against the calibrated value, ppm, when known.</param>
public sealed record CheckView(
    string Name,
    int Seq,
    DateTimeOffset At,
    double ValueOhms,
    double SigmaScore,
    bool InControl,
    string Reason,
    int Flagged,
    double? GainPpm
);
