namespace SortRig.Planning.Assembly;

/// <summary>The neighbourhood search's second phase: scattered windows around leftover parts.</summary>
internal sealed partial class NeighbourhoodSearch
{
    // Second phase: windows around a leftover part made of items drawn at random from its neighbours (seeded, so
    // deterministic): sets that pair parts far apart in z (a high and a low part in a pair, two legs off together)
    // are reachable when contiguous windows miss them. Stops after as many failures in a row as there are items.
    private void Scatter(
        List<(Option[] Fills, SetVerdict Verdict)> sets,
        int bound,
        Func<bool> outOfTime,
        CancellationToken cancellationToken
    )
    {
        var rng = new Random(12);
        var items = Items(sets);
        var limit = options.NeighbourhoodParts;
        for (var failures = 0; failures < Math.Max(200, items.Count) && sets.Count < bound && !outOfTime(); failures++)
        {
            cancellationToken.ThrowIfCancellationRequested();
            var leftovers = Enumerable.Range(0, items.Count).Where(i => items[i].Set < 0).ToList();
            if (leftovers.Count == 0)
            {
                return;
            }

            var at = leftovers[rng.Next(leftovers.Count)];
            var window = new List<Item> { items[at] };
            var parts = items[at].Parts.Length;
            var near = Enumerable
                .Range(Math.Max(0, at - limit), Math.Min(items.Count, at + limit + 1) - Math.Max(0, at - limit))
                .Where(i => i != at)
                .OrderBy(_ => rng.Next())
                .ToList();
            foreach (var i in near)
            {
                if (parts + items[i].Parts.Length <= limit)
                {
                    window.Add(items[i]);
                    parts += items[i].Parts.Length;
                }
            }

            if (TryRepack(sets, window))
            {
                Replaced++;
                failures = 0;
                items = Items(sets);
            }
        }
    }
}
