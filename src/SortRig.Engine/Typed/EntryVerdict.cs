namespace SortRig.Engine.Typed;

/// <summary>The check of one typed entry: a value in ohms, or the problem to show before asking again.</summary>
/// <param name="Ohms">The value when the entry passed, else NaN.</param>
/// <param name="Problem">One plain line saying what is wrong and asking to re-enter; null when the entry
/// passed.</param>
public sealed record EntryVerdict(double Ohms, string? Problem)
{
    /// <summary>True when the entry is a value that may reach the settle rule.</summary>
    public bool Passed => Problem is null;

    internal static EntryVerdict Value(double ohms) => new(ohms, null);

    internal static EntryVerdict Refuse(string problem) => new(double.NaN, problem);
}
