using System.Globalization;

namespace SortRig.Host.Tests.Reliability.Support;

/// <summary>The sequence of crashes one test run goes through.</summary>
internal static class CrashPlan
{
    /// <summary>
    /// Migration kills first (on the fresh file), then read/commit/announce hook kills and kills at
    /// random moments, shuffled. 4 + 5 + 6 + 5 + 5 = 25 kills.
    /// </summary>
    public static List<Step> Make(Random rng, int migrationKills)
    {
        var steps = Enumerable.Range(0, migrationKills).Select(_ => new Step("migration", rng.Next(2, 45))).ToList();
        var later = new List<Step>();
        later.AddRange(Enumerable.Range(0, 5).Select(_ => new Step("read", rng.Next(1, 4))));
        later.AddRange(Enumerable.Range(0, 6).Select(_ => new Step("commit", rng.Next(1, 4))));
        later.AddRange(Enumerable.Range(0, 5).Select(_ => new Step("announce", rng.Next(1, 4))));
        later.AddRange(Enumerable.Range(0, 5).Select(_ => new Step("random", rng.Next(1, 3))));
        steps.AddRange(later.OrderBy(_ => rng.Next()));
        return steps;
    }

    /// <summary>One run: how it is killed.</summary>
    /// <param name="Kind">migration, read, commit, announce, random, or finish (no kill).</param>
    /// <param name="N">Which write to the WAL (migration), which pass of the point (hooks), after which announcement
    /// (random).</param>
    internal sealed record Step(string Kind, int N)
    {
        public static Step Finish { get; } = new("finish", 0);

        public string Detail =>
            Kind switch
            {
                "migration" => $"wal write {N}",
                "random" => $"after part {N}",
                "finish" => "",
                _ => $"pass {N}",
            };

        public string? CrashAt => Kind is "read" or "commit" or "announce" ? $"{Kind}:{N}" : null;

        /// <summary>strace stops the process at its N-th write to the WAL file, inside the migration's
        /// transaction.</summary>
        public IReadOnlyList<string>? Strace(string db) =>
            Kind == "migration"
                ?
                [
                    "-f",
                    "-qq",
                    "-o",
                    "/dev/null",
                    "-P",
                    db + "-wal",
                    "-e",
                    "trace=pwrite64",
                    "-e",
                    "inject=pwrite64:signal=KILL:when=" + N.ToString(CultureInfo.InvariantCulture),
                ]
                : null;

        /// <summary>Random kills: a random 0-300 ms after the N-th new announcement of the run.</summary>
        public Func<string, TimeSpan?>? KillAfter(Random rng)
        {
            if (Kind != "random")
            {
                return null;
            }

            var delay = TimeSpan.FromMilliseconds(rng.Next(0, 300));
            var seen = 0;
            return line =>
                line.StartsWith("part ", StringComparison.Ordinal)
                && !line.Contains("(repeated)", StringComparison.Ordinal)
                && ++seen == N
                    ? delay
                    : null;
        }
    }
}
