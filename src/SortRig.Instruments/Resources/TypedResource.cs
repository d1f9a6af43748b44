namespace SortRig.Instruments.Resources;

/// <summary>
/// TYPED::profile[::INSTR] — our form for a meter with no computer link: the operator reads its display and types
/// each value. <paramref name="Profile"/> names a typed-meter profile (instruments/typed/&lt;profile&gt;.yaml).
/// Never opened as a link.
/// </summary>
public sealed record TypedResource(string Text, string Profile) : InstrumentResource(Text)
{
    /// <inheritdoc/>
    public override TransportKind Transport => TransportKind.Typed;
}
