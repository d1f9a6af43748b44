namespace SortRig.Instruments.Profiles;

/// <summary>
/// A meter profile is invalid. The message reads "FILE:LINE:COLUMN: FIELD: PROBLEM; expected WHAT".
/// </summary>
public sealed class ProfileException : InstrumentException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="file">The profile file.</param>
    /// <param name="line">1-based line of the offending node (0 when unknown).</param>
    /// <param name="column">1-based column of the offending node (0 when unknown).</param>
    /// <param name="field">Dotted path of the field, e.g. "ranges[2].accuracy_1y.range_pct".</param>
    /// <param name="problem">What is wrong.</param>
    /// <param name="expected">What was expected instead.</param>
    /// <param name="innerException">The YAML parser fault, if any.</param>
    public ProfileException(
        string file,
        int line,
        int column,
        string field,
        string problem,
        string expected,
        Exception? innerException = null
    )
        : base(
            $"{file}:{line}:{column}: {(field.Length == 0 ? "(document)" : field)}: {problem}; expected {expected}",
            innerException
        )
    {
        File = file;
        Line = line;
        Column = column;
        Field = field;
        Problem = problem;
        Expected = expected;
    }

    /// <summary>The profile file.</summary>
    public string File { get; }

    /// <summary>1-based line of the offending node.</summary>
    public int Line { get; }

    /// <summary>1-based column of the offending node.</summary>
    public int Column { get; }

    /// <summary>Dotted path of the field, e.g. "ranges[2].accuracy_1y.range_pct"; empty for the whole
    /// document.</summary>
    public string Field { get; }

    /// <summary>What is wrong.</summary>
    public string Problem { get; }

    /// <summary>What was expected instead.</summary>
    public string Expected { get; }
}
