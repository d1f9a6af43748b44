namespace SortRig.Simulator.Faults;

/// <summary>The faults the simulated meter can inject.</summary>
public enum FaultKind
{
    /// <summary>Instead of a reply, TCP closes the socket; serial goes silent for <see
    /// cref="FaultOptions.SerialSilence"/>.</summary>
    DropConnection = 0,

    /// <summary>The reply is held back for <see cref="FaultInjector.ReplyDelay"/> before it is sent.</summary>
    DelayReply = 1,

    /// <summary>The reply has characters flipped, or is cut short (the line terminator is kept).</summary>
    GarbleReply = 2,

    /// <summary>-310 "System error" is pushed into the error queue before the message runs.</summary>
    SpuriousError = 3,

    /// <summary>The meter silently returns to its *RST settings before the message runs.</summary>
    SilentReset = 4,

    /// <summary>
    /// Every reading of the next reading reply is 9.91E+37, the SCPI not-a-number value (as a meter answers a
    /// measurement it could not make); the rest of the exchange is untouched.
    /// </summary>
    NotANumber = 5,
}
