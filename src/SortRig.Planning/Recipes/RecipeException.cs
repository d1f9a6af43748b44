namespace SortRig.Planning.Recipes;

/// <summary>A recipe that cannot be used: names the file, the line and column, the field and what was
/// expected.</summary>
public sealed class RecipeException : Exception
{
    /// <summary>Creates the error; the message reads "file:line:column: field: expected ...".</summary>
    /// <param name="fileName">File the recipe came from.</param>
    /// <param name="line">1-based line of the offending node (0 when unknown).</param>
    /// <param name="column">1-based column of the offending node (0 when unknown).</param>
    /// <param name="fieldPath">Path of the field, e.g. "positions[2].nominal".</param>
    /// <param name="expected">What the field must hold.</param>
    /// <param name="inner">Underlying parser error, if any.</param>
    public RecipeException(
        string fileName,
        int line,
        int column,
        string fieldPath,
        string expected,
        Exception? inner = null
    )
        : base($"{fileName}:{line}:{column}: {fieldPath}: expected {expected}", inner)
    {
        FileName = fileName;
        Line = line;
        Column = column;
        FieldPath = fieldPath;
        Expected = expected;
    }

    /// <summary>File the recipe came from.</summary>
    public string FileName { get; }

    /// <summary>1-based line (0 when unknown).</summary>
    public int Line { get; }

    /// <summary>1-based column (0 when unknown).</summary>
    public int Column { get; }

    /// <summary>Field path, e.g. "outputs[1].tolerance-ppm".</summary>
    public string FieldPath { get; }

    /// <summary>What the field must hold.</summary>
    public string Expected { get; }
}
