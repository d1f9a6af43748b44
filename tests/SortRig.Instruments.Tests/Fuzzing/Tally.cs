namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>How many fuzz inputs a parser accepted and refused.</summary>
internal sealed class Tally
{
    public int Accepted { get; set; }

    public int Refused { get; set; }

    /// <inheritdoc/>
    public override string ToString() => $"{Accepted} accepted, {Refused} refused";
}
