namespace SortRig.Planning.Cups;

/// <summary>Our cup labels: letters A–Z without I and O (read as 1 and 0) and without R, which marks the reject
/// cup.</summary>
public static class CupLabels
{
    private static readonly string s_letters = "ABCDEFGHJKLMNPQSTUVWXYZ";

    /// <summary>The reject cup's label.</summary>
    public const string Reject = "R";

    /// <summary>Most regular cups that can be labelled (23).</summary>
    public const int MaxCups = 23;

    /// <summary>Label of regular cup <paramref name="index"/> (0-based, below <see cref="MaxCups"/>).</summary>
    public static string For(int index) => s_letters[index].ToString();

    /// <summary>Index of a regular cup label, or -1.</summary>
    public static int IndexOf(string label) =>
        label.Length == 1 ? s_letters.IndexOf(label[0], StringComparison.Ordinal) : -1;
}
