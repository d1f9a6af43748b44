namespace SortRig.Planning.Ordering;

/// <summary>One quantity break: from <paramref name="Quantity"/> parts on, each costs <paramref
/// name="UnitPrice"/>.</summary>
/// <param name="Quantity">Smallest order quantity of the break, parts (≥ 1).</param>
/// <param name="UnitPrice">Price per part at this break, in the caller's currency (≥ 0).</param>
public readonly record struct PriceBreak(int Quantity, double UnitPrice);

/// <summary>Unit prices by quantity break for one nominal. The first break applies from 1 part even if it says
/// more.</summary>
public sealed record PriceBreaks
{
    /// <summary>Creates validated breaks.</summary>
    /// <param name="breaks">At least one break; quantities ≥ 1 and distinct; prices finite and ≥ 0.</param>
    public PriceBreaks(IEnumerable<PriceBreak> breaks)
    {
        ArgumentNullException.ThrowIfNull(breaks);
        var sorted = breaks.OrderBy(b => b.Quantity).ToArray();
        if (sorted.Length == 0)
        {
            throw new ArgumentException("prices need at least one quantity break", nameof(breaks));
        }

        foreach (var b in sorted)
        {
            if (b.Quantity < 1 || !double.IsFinite(b.UnitPrice) || b.UnitPrice < 0)
            {
                throw new ArgumentException(
                    FormattableString.Invariant(
                        $"price break {b.Quantity}: quantity must be ≥ 1 and the unit price a number ≥ 0"
                    ),
                    nameof(breaks)
                );
            }
        }

        if (sorted.Select(b => b.Quantity).Distinct().Count() != sorted.Length)
        {
            throw new ArgumentException("price breaks repeat a quantity", nameof(breaks));
        }

        Breaks = sorted;
    }

    /// <summary>The breaks by rising quantity.</summary>
    public IReadOnlyList<PriceBreak> Breaks { get; }

    /// <summary>Unit price at <paramref name="quantity"/> parts: the largest break not above it (the first break below
    /// it).</summary>
    public double UnitPriceAt(int quantity) => Breaks.LastOrDefault(b => b.Quantity <= quantity, Breaks[0]).UnitPrice;

    /// <summary>Cost of exactly <paramref name="quantity"/> parts.</summary>
    public double Cost(int quantity) => quantity <= 0 ? 0 : quantity * UnitPriceAt(quantity);

    /// <summary>
    /// The cheapest way to get at least <paramref name="quantity"/> parts: the quantity itself or a higher break whose
    /// total is lower (e.g. 100 at 0.05 costs less than 90 at 0.10).
    /// </summary>
    public (int Quantity, double Cost) CheapestAtLeast(int quantity)
    {
        var best = (Quantity: quantity, Cost: Cost(quantity));
        foreach (var b in Breaks.Where(b => b.Quantity > quantity))
        {
            var c = Cost(b.Quantity);
            if (c < best.Cost)
            {
                best = (b.Quantity, c);
            }
        }

        return best;
    }
}
