using System.Globalization;
using FsCheck;
using FsCheck.Fluent;
using Microsoft.FSharp.Core;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>
/// Runs a fuzz property through FsCheck with a fixed, reproducible seed. Two environment variables
/// widen a run without editing code: SORTRIG_FUZZ_SEED="seed,gamma" (the pair FsCheck prints on a
/// failure, to replay it; "random" for a fresh seed) and SORTRIG_FUZZ_COUNT (inputs per property).
/// </summary>
internal static class FuzzRun
{
    /// <summary>Inputs per property in an ordinary test run.</summary>
    public const int DefaultCount = 10_000;

    // Fixed so that the figures in docs/reliability-fuzzing.md can be reproduced; the gamma must be odd.
    private const ulong DefaultSeed = 20_260_611;
    private const ulong DefaultGamma = 0x9E37_79B9_7F4A_7C15;

    /// <summary>The number of inputs each property gets.</summary>
    public static int Count =>
        int.TryParse(
            Environment.GetEnvironmentVariable("SORTRIG_FUZZ_COUNT"),
            NumberStyles.None,
            CultureInfo.InvariantCulture,
            out var n
        )
        && n > 0
            ? n
            : DefaultCount;

    /// <summary>
    /// Checks <paramref name="property"/> (which throws on a violation) on <see cref="Count"/>
    /// inputs drawn from <paramref name="generator"/>; returns how many inputs were drawn. On a
    /// failure FsCheck throws with the input and the replay seed.
    /// </summary>
    public static int Check<T>(Gen<T> generator, Action<T> property)
    {
        var drawn = 0;
        var config = Config.QuickThrowOnFailure.WithMaxTest(Count).WithQuietOnSuccess(true).WithReplay(Seed());
        FsCheck.Check.One(config, Prop.ForAll(generator.ToArbitrary(), (T input) =>
            {
                drawn++;
                property(input);
            }));
        return drawn;
    }

    private static FSharpOption<Replay> Seed()
    {
        var text = Environment.GetEnvironmentVariable("SORTRIG_FUZZ_SEED");
        if (string.Equals(text, "random", StringComparison.OrdinalIgnoreCase))
        {
            return FSharpOption<Replay>.None;
        }

        var (seed, gamma) = (DefaultSeed, DefaultGamma);
        var pair = text?.Trim('(', ')', ' ').Split(',');
        if (
            pair is { Length: 2 }
            && ulong.TryParse(pair[0], NumberStyles.Integer, CultureInfo.InvariantCulture, out var s)
            && ulong.TryParse(pair[1], NumberStyles.Integer, CultureInfo.InvariantCulture, out var g)
        )
        {
            (seed, gamma) = (s, g);
        }

        return FSharpOption<Replay>.Some(new Replay(new Rnd(seed, gamma), FSharpOption<int>.None));
    }
}
