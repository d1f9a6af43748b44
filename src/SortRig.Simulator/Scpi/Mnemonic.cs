namespace SortRig.Simulator.Scpi;

/// <summary>
/// A SCPI keyword in its documented spelling, e.g. "RESistance": the upper-case part is the short
/// form. A token matches the short or the long form exactly, in any case (SCPI-99 vol. 1 sec. 6.2.1).
/// </summary>
internal sealed record Mnemonic(string Long)
{
    public string Short { get; } = new(Long.TakeWhile(c => !char.IsLower(c)).ToArray());

    public bool Matches(string token) =>
        token.Equals(Short, StringComparison.OrdinalIgnoreCase)
        || token.Equals(Long, StringComparison.OrdinalIgnoreCase);

    public override string ToString() => Long;
}
