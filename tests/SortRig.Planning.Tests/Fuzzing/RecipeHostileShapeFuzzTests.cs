using System.Globalization;
using System.Text;
using FsCheck;
using FsCheck.Fluent;
using SortRig.Planning.Recipes;
using Xunit.Abstractions;

namespace SortRig.Planning.Tests.Fuzzing;

/// <summary>
/// Fuzzes <see cref="RecipeLoader.Load"/> with hostile shapes around the documented limits, each with an exact oracle:
/// nesting from 1 to 100 000 levels (flow lists and maps mixed) is refused for depth exactly when it crosses
/// <see cref="RecipeLimits.MaxDepth"/>; text padded to within a few bytes of <see cref="RecipeLimits.MaxBytes"/> (with
/// multi-byte characters) is refused for size exactly when its UTF-8 form is larger; a control character anywhere in a
/// name is refused naming the field and the character. Nothing but <see cref="RecipeException"/> ever comes out.
/// </summary>
public sealed class RecipeHostileShapeFuzzTests(ITestOutputHelper output)
{
    private const int Inputs = 1_500;

    [Fact]
    public void Load_HostileShapes_RefusedExactlyAtTheLimits()
    {
        var tally = new Dictionary<string, int>(StringComparer.Ordinal);
        Prop.ForAll(Arb.From(Shapes()), shape => Check(shape, tally))
            .Check(Config.QuickThrowOnFailure.WithMaxTest(Inputs).WithQuietOnSuccess(true));

        output.WriteLine(
            string.Join(", ", tally.OrderBy(t => t.Key, StringComparer.Ordinal).Select(t => $"{t.Key} {t.Value}"))
        );
        // Every kind of shape, on both sides of each limit, must have been drawn.
        Assert.All(new[] { "deep-refused", "deep-field", "big-refused", "big-loaded", "control-refused" }, k =>
            Assert.True(tally.GetValueOrDefault(k) >= 20, $"{k}: only {tally.GetValueOrDefault(k)}")
        );
    }

    private static void Check(HostileShape shape, Dictionary<string, int> tally)
    {
        var text = shape.Text();
        Recipe? recipe = null;
        RecipeException? refused = null;
        try
        {
            recipe = RecipeLoader.Load(text, "hostile.yaml");
        }
        catch (RecipeException e)
        {
            refused = e;
        }
        catch (Exception e)
        {
            Assert.Fail($"{e.GetType().Name} escaped the loader for {shape}: {e.Message}");
        }

        switch (shape.Kind)
        {
            case ShapeKind.Deep when shape.Depth + 1 > RecipeLimits.MaxDepth: // the root map is level 1
                Assert.True(
                    refused?.Message.Contains($"nested at most {RecipeLimits.MaxDepth} deep", StringComparison.Ordinal)
                        == true,
                    $"{shape}: {refused?.Message}"
                );
                Count(tally, "deep-refused");
                break;
            case ShapeKind.Deep:
                // Within the limit the nesting reaches the field checks: a description must be text.
                Assert.True(refused?.FieldPath == "description", $"{shape}: {refused?.Message}");
                Count(tally, "deep-field");
                break;
            case ShapeKind.Big when Encoding.UTF8.GetByteCount(text) > RecipeLimits.MaxBytes:
                Assert.True(
                    refused?.Message.StartsWith(
                        "hostile.yaml:1:1: (document): expected a recipe of at most",
                        StringComparison.Ordinal
                    ) == true,
                    $"{shape}: {refused?.Message}"
                );
                Count(tally, "big-refused");
                break;
            case ShapeKind.Big:
                Assert.True(recipe is not null, $"{shape}: {refused?.Message}");
                Count(tally, "big-loaded");
                break;
            case ShapeKind.Control:
                Assert.True(refused is not null, $"{shape}: loaded");
                Assert.True(
                    refused.FieldPath == "recipe" || refused.FieldPath.EndsWith(".name", StringComparison.Ordinal),
                    $"{shape}: {refused.Message}"
                );
                Assert.True(
                    refused.Message.Contains(
                        string.Create(CultureInfo.InvariantCulture, $"U+{(int)shape.Character:X4}"),
                        StringComparison.Ordinal
                    ),
                    $"{shape}: {refused.Message}"
                );
                Count(tally, "control-refused");
                break;
        }
    }

    private static void Count(Dictionary<string, int> tally, string key) =>
        tally[key] = tally.GetValueOrDefault(key) + 1;

    private static Gen<HostileShape> Shapes() =>
        from kind in Gen.Elements(ShapeKind.Deep, ShapeKind.Big, ShapeKind.Control)
        from file in Gen.Choose(0, ShippedRecipes.Files.Count - 1)
        from depth in Gen.Frequency((6, Gen.Choose(1, 45)), (1, Gen.Choose(1_000, 100_000)))
        from openers in Gen.Choose(0, int.MaxValue)
        from delta in Gen.Choose(-4, 4)
        from wide in Gen.Choose(0, 3)
        from character in Gen.Elements(ControlCharacters)
        from at in Gen.Choose(0, 2)
        from field in Gen.Choose(0, 1)
        select new HostileShape(kind, file, depth, openers, delta, wide, character, at, field);

    // Every control character (C0, DEL and C1), as char.IsControl defines them (Unicode category Cc).
    private static char[] ControlCharacters { get; } =
    [.. Enumerable.Range(0, 0xA0).Select(i => (char)i).Where(char.IsControl)];
}

internal enum ShapeKind
{
    Deep,
    Big,
    Control,
}

/// <summary>One hostile input built from a shipped recipe.</summary>
internal sealed record HostileShape(
    ShapeKind Kind,
    int File,
    int Depth,
    int Openers,
    int Delta,
    int Wide,
    char Character,
    int At,
    int Field
)
{
    public string Text()
    {
        var source = ShippedRecipes.Files[File].Text;
        return Kind switch
        {
            ShapeKind.Deep => Nested(source),
            ShapeKind.Big => Padded(source),
            _ => WithControl(source),
        };
    }

    public override string ToString() =>
        Kind switch
        {
            ShapeKind.Deep => $"{ShippedRecipes.Files[File].Name} description nested {Depth} deep",
            ShapeKind.Big =>
                $"{ShippedRecipes.Files[File].Name} padded to MaxBytes{Delta:+0;-0} with {Wide} two-byte characters",
            _ => $"{ShippedRecipes.Files[File].Name} {(Field == 0 ? "recipe name" : "first name")} with U+"
                + $"{(int)Character:X4}",
        };

    // The description's value becomes Depth nested flow collections, each a list or a one-key map (chosen by the
    // bits of Openers), closed properly: only the depth is wrong.
    private string Nested(string source)
    {
        var open = new StringBuilder();
        var close = new StringBuilder();
        for (var i = 0; i < Depth; i++)
        {
            var map = ((Openers >> (i % 31)) & 1) == 1;
            open.Append(map ? "{k: " : "[");
            close.Insert(0, map ? '}' : ']');
        }

        return WithoutDescription(source) + "description: " + open + "x" + close + "\n";
    }

    // A comment pads the file to MaxBytes + Delta bytes in UTF-8; Wide of its characters take two bytes (é).
    private string Padded(string source)
    {
        var head = source.TrimEnd('\n') + "\n# ";
        var target = RecipeLimits.MaxBytes + Delta - Encoding.UTF8.GetByteCount(head) - 1; // the final LF
        var wide = Math.Min(Wide, target / 2);
        return head + new string('é', wide) + new string('p', target - (2 * wide)) + "\n";
    }

    // The recipe's name, or the first "name:" value in the file, gets the character at its start, middle or end,
    // written as a YAML double-quoted escape so the parser hands it to the loader as is (YAML 1.1 sec. 5.7).
    private string WithControl(string source)
    {
        var escape = string.Create(CultureInfo.InvariantCulture, $"\\x{(int)Character:X2}");
        var lines = source.Split('\n');
        for (var i = 0; i < lines.Length; i++)
        {
            var key = Field == 0 ? "recipe: " : "name: ";
            var k = lines[i].IndexOf(key, StringComparison.Ordinal);
            if (k < 0 || (Field == 0 && k != 0) || lines[i].TrimStart().StartsWith('#'))
            {
                continue;
            }

            var start = k + key.Length;
            var end = lines[i].IndexOfAny([',', '}'], start) is var e and >= 0 ? e : lines[i].Length;
            var value = lines[i][start..end].Trim();
            var cut = At switch
            {
                0 => 0,
                1 => value.Length / 2,
                _ => value.Length,
            };
            lines[i] = lines[i][..start] + "\"" + value[..cut] + escape + value[cut..] + "\"" + lines[i][end..];
            return string.Join('\n', lines);
        }

        throw new InvalidOperationException(
            $"{ShippedRecipes.Files[File].Name} has no '{(Field == 0 ? "recipe" : "name")}' line"
        );
    }

    private static string WithoutDescription(string source) =>
        string.Join('\n', source.Split('\n').Where(l => !l.StartsWith("description:", StringComparison.Ordinal)));
}
