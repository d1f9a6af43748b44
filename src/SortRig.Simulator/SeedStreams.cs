namespace SortRig.Simulator;

/// <summary>Derives independent seeds for each random stream from the one bench seed.</summary>
internal static class SeedStreams
{
    public const int Reel = 1;
    public const int Noise = 2;
    public const int Bounce = 3;
    public const int Operator = 4;
    public const int Faults = 5;
    public const int Gain = 6;
    public const int LooseParts = 7;
    public const int Physics = 8;
    public const int Excess = 9;
    public const int Wander = 10;

    public static int Derive(int seed, int stream)
    {
        unchecked
        {
            // SplitMix-style mixing (common practice, no source): distinct streams get unrelated seeds.
            var z = (ulong)(uint)seed + ((ulong)stream * 0x9E3779B97F4A7C15UL);
            z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
            z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
            return (int)((z ^ (z >> 31)) & 0x7FFFFFFF);
        }
    }
}
