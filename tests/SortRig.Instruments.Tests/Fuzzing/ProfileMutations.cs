using FsCheck;
using FsCheck.Fluent;
using SortRig.Instruments.Tests.Support;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>A shipped profile after some edits; prints as the file name and the edits.</summary>
internal sealed record ProfileCase(string File, string Text, string Edits)
{
    /// <inheritdoc/>
    public override string ToString() => $"{Path.GetFileName(File)} with {Edits}";
}

/// <summary>Generators of damaged meter profiles, starting from the four shipped instruments/*.yaml.</summary>
internal static class ProfileMutations
{
    /// <summary>YAML's indicator characters (YAML 1.2 sec. 5.3, from memory) and white space.</summary>
    public const string Syntax = ":-[]{},#&*!|>'\"%@`? \t\n";

    private static readonly (string Path, string Text)[] s_shipped =
    [
        .. Directory
            .GetFiles(RepoPaths.Instruments, "*.yaml")
            .Order(StringComparer.Ordinal)
            .Select(p => (p, File.ReadAllText(p))),
    ];

    private static readonly string[] s_knownKeys =
    [
        "family",
        "identity",
        "model",
        "comms",
        "transports",
        "terminator",
        "query_timeout_s",
        "serial",
        "baud",
        "parity",
        "wiring",
        "two_wire",
        "four_wire",
        "range_change_settle_s",
        "over_range",
        "ranges",
        "full_scale",
        "accuracy_24h",
        "reading_pct",
        "range_pct",
        "test_current_a",
        "nplc",
        "digits",
        "noise_ppm",
        "commands",
        "read",
        "init",
        "fetch",
    ];

    /// <summary>The shipped profiles (path and text); a run needs all four.</summary>
    public static IReadOnlyList<(string Path, string Text)> Shipped => s_shipped;

    /// <summary>A shipped profile with 1-4 edits applied in turn.</summary>
    public static Gen<ProfileCase> Any =>
        from file in Gen.Elements(s_shipped)
        from edits in Gen.Choose(1, 4).SelectMany(n => Gen.ArrayOf(Edit, n))
        select new ProfileCase(
            file.Path,
            edits.Aggregate(file.Text, (t, e) => e.ApplyTo(t)),
            string.Join(" ", edits.Select(e => e.ToString()))
        );

    private static Gen<ProfileEdit> Edit =>
        from kind in Gen.Frequency(
            (2, Gen.Constant(ProfileEditKind.DeleteLine)),
            (1, Gen.Constant(ProfileEditKind.DuplicateLine)),
            (1, Gen.Constant(ProfileEditKind.SwapLines)),
            (1, Gen.Constant(ProfileEditKind.Indent)),
            (1, Gen.Constant(ProfileEditKind.Dedent)),
            (5, Gen.Constant(ProfileEditKind.ReplaceScalar)),
            (2, Gen.Constant(ProfileEditKind.InsertKey)),
            (2, Gen.Constant(ProfileEditKind.InsertNoise)),
            (1, Gen.Constant(ProfileEditKind.Truncate))
        )
        from at in Gen.Choose(0, int.MaxValue)
        from payload in kind switch
        {
            ProfileEditKind.Indent => Gen.Elements(" ", "  ", "   ", "    ", "\t", "      "),
            ProfileEditKind.ReplaceScalar => Scalar,
            ProfileEditKind.InsertKey => from key in Gen.Frequency((1, Gen.Elements(s_knownKeys)), (1, Word))
            from value in Scalar
            select $"{key}: {value}",
            ProfileEditKind.InsertNoise => Noise,
            _ => Gen.Constant(string.Empty),
        }
        select new ProfileEdit(kind, at, payload);

    /// <summary>Replacement values: numbers good and bad, empty, YAML specials, and random text.</summary>
    private static Gen<string> Scalar =>
        Gen.Frequency(
            (
                3,
                Gen.Elements(
                    string.Empty,
                    "0",
                    "-0",
                    "-1",
                    "-1000",
                    "1e999",
                    "-1e-999",
                    "1.0e-300",
                    "1e12",
                    "4000001",
                    "2147483648",
                    ".inf",
                    "-.inf",
                    ".nan",
                    "NaN",
                    "Infinity",
                    "0x10",
                    "1_000",
                    "1,5",
                    "~",
                    "null",
                    "true",
                    "no",
                    "\"5\"",
                    "'5'",
                    "[1, 2]",
                    "{a: 1}",
                    "[]",
                    "{}",
                    "&x 5",
                    "*x",
                    "*undefined",
                    "!!str 5",
                    "!!int x",
                    "!!binary AAA",
                    "|",
                    ">",
                    "@",
                    "`",
                    "%YAML",
                    "? x",
                    "- x",
                    "'unclosed",
                    "\"unclosed",
                    "[unclosed",
                    "{unclosed",
                    "\"\\q\"",
                    "\"\\u00\"",
                    "RES",
                    "FRES",
                    "READ?",
                    "{function}",
                    "\"{bogus}\"",
                    "'('"
                )
            ),
            (
                2,
                Gen.Choose(-1_000_000, 1_000_000)
                    .SelectMany(v => Gen.Choose(-30, 30).Select(e => FormattableString.Invariant($"{v}e{e}")))
            ),
            (2, TextMutations.Chunk(Syntax)),
            (1, Word)
        );

    private static Gen<string> Word =>
        Gen.Choose(1, 12)
            .SelectMany(n => Gen.ArrayOf(Gen.Elements("abcdefghijklmnopqrstuvwxyz_0123456789".ToCharArray()), n))
            .Select(a => new string(a));

    /// <summary>Random bytes read as Latin-1, YAML indicators, tabs, unclosed brackets and quotes.</summary>
    private static Gen<string> Noise =>
        Gen.Frequency(
            (2, TextMutations.Chunk(Syntax)),
            (
                1,
                Gen.Choose(1, 8)
                    .SelectMany(n => Gen.ArrayOf(Gen.Choose(0, 255).Select(b => (char)b), n))
                    .Select(a => new string(a))
            ),
            (
                1,
                Gen.Elements(
                    "\t",
                    "[",
                    "{",
                    "\"",
                    "'",
                    "[[[[",
                    "{{",
                    "\"\"\"",
                    "\n\t",
                    ": ",
                    "- ",
                    "---\n",
                    "...\n",
                    "&a ",
                    "*a ",
                    "<<: *a\n"
                )
            )
        );
}
