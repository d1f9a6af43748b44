namespace SortRig.Instruments.Resources;

/// <summary>
/// A resource string could not be parsed. Names the part ("::"-separated, counted from 1) or
/// serial option that is wrong, where it starts, and what was expected there.
/// </summary>
public sealed class ResourceStringException : InstrumentException
{
    /// <summary>Creates the exception; the message reads "TEXT: part N 'PART' PROBLEM".</summary>
    /// <param name="resource">The whole resource string as given.</param>
    /// <param name="partNumber">1-based number of the offending part (or of the option, when <paramref
    /// name="isOption"/>); 0 for the whole string.</param>
    /// <param name="partText">The offending part's text.</param>
    /// <param name="offset">Character offset of the part in <paramref name="resource"/>.</param>
    /// <param name="problem">What is wrong, e.g. "is not a port number 1-65535".</param>
    /// <param name="expected">What was expected, e.g. "a port number 1-65535".</param>
    /// <param name="isOption">True when the part is a serial option after '?'.</param>
    public ResourceStringException(
        string resource,
        int partNumber,
        string partText,
        int offset,
        string problem,
        string expected,
        bool isOption = false
    )
        : base($"{resource}: {(isOption ? "option" : "part")} {partNumber} '{partText}' {problem}")
    {
        Resource = resource;
        PartNumber = partNumber;
        PartText = partText;
        Offset = offset;
        Expected = expected;
        IsOption = isOption;
    }

    /// <summary>The whole resource string.</summary>
    public string Resource { get; }

    /// <summary>1-based number of the offending part or option; 0 for the whole string.</summary>
    public int PartNumber { get; }

    /// <summary>The offending part's text.</summary>
    public string PartText { get; }

    /// <summary>Character offset of the part in the resource string.</summary>
    public int Offset { get; }

    /// <summary>What was expected at that place.</summary>
    public string Expected { get; }

    /// <summary>True when the offending part is a serial option after '?'.</summary>
    public bool IsOption { get; }
}
