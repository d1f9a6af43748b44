using System.Diagnostics;
using FsCheck;
using FsCheck.Fluent;
using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;
using Xunit.Abstractions;

namespace SortRig.Planning.Tests.Fuzzing;

/// <summary>
/// Fuzzes <see cref="RecipeLoader.Load"/> with FsCheck-generated mutations of the shipped recipes (lines deleted,
/// duplicated, swapped, re-indented; scalars replaced by negative, zero, huge, NaN, empty or structured values; unknown
/// and renamed keys; node names swapped; truncation; junk bytes; unclosed brackets and quotes). The only exception
/// allowed out is <see cref="RecipeException"/>, naming the file, a line within the text and a field path or YAML
/// problem; a recipe that loads must hold finite nominals and (network form) evaluate at nominal without throwing.
/// </summary>
public sealed class RecipeLoaderFuzzTests(ITestOutputHelper output)
{
    private const int Inputs = 12_000;
    private const string FileName = "fuzzed.yaml";

    [Fact]
    public void Load_MutatedShippedRecipes_OnlyRecipeExceptionNamingWhere()
    {
        var stats = new FuzzStats();
        var clock = Stopwatch.StartNew();
        Prop.ForAll(RecipeFuzzArbitraries.Cases(), c => Check(c, stats))
            .Check(Config.QuickThrowOnFailure.WithMaxTest(Inputs).WithQuietOnSuccess(true));
        clock.Stop();

        output.WriteLine(
            $"{stats.Total} inputs in {clock.Elapsed.TotalSeconds:F1} s: {stats.Loaded} loaded, {stats.Refused} "
                + $"refused, "
                + $"{stats.YamlProblems} of them YAML problems, {stats.Paths.Count} distinct field paths"
        );
        foreach (var (path, n) in stats.Paths.OrderByDescending(p => p.Value).Take(25))
        {
            output.WriteLine($"  {n, 6}  {path}");
        }

        Assert.True(stats.Total >= 10_000, $"only {stats.Total} inputs");
        // The mutations must reach past the YAML parser into the field checks, and some must still load.
        Assert.True(
            stats.Refused - stats.YamlProblems > stats.Total / 3,
            $"{stats.Refused - stats.YamlProblems} field errors of {stats.Total}"
        );
        Assert.True(stats.Paths.Count >= 40, $"only {stats.Paths.Count} distinct field paths reached");
        Assert.True(stats.Loaded > stats.Total / 50, $"only {stats.Loaded} inputs loaded");
    }

    internal static void Check(RecipeFuzzCase c, FuzzStats stats)
    {
        var text = c.Text();
        var lineCount = YamlLineCount(text);
        stats.Total++;
        Recipe recipe;
        try
        {
            recipe = RecipeLoader.Load(text, FileName);
        }
        catch (RecipeException e)
        {
            stats.Refused++;
            stats.YamlProblems += e.FieldPath == "(document)" ? 1 : 0;
            stats.Paths[Normalise(e.FieldPath)] = stats.Paths.GetValueOrDefault(Normalise(e.FieldPath)) + 1;
            Assert.True(
                e.Line >= 1 && e.Line <= lineCount + 1,
                $"line {e.Line} outside 1..{lineCount + 1}: {e.Message}\n{c}\n{text}"
            );
            Assert.Equal(FileName, e.FileName);
            Assert.False(string.IsNullOrWhiteSpace(e.FieldPath), $"no field path: {e.Message}\n{c}\n{text}");
            Assert.False(string.IsNullOrWhiteSpace(e.Expected), $"nothing expected: {e.Message}\n{c}");
            Assert.StartsWith(
                $"{FileName}:{e.Line}:{e.Column}: {e.FieldPath}: expected ",
                e.Message,
                StringComparison.Ordinal
            );
            return;
        }
        catch (Exception e)
        {
            Assert.Fail($"{e.GetType().Name} escaped the loader: {e.Message}\n{c}\n---\n{text}\n---\n{e}");
            return;
        }

        stats.Loaded++;
        Assert.All(recipe.Positions, p =>
            Assert.True(double.IsFinite(p.Nominal) && p.Nominal > 0, $"{p.Name} nominal {p.Nominal}\n{c}")
        );
        if (recipe.Form == RecipeForm.Network)
        {
            var checks = NetworkEvaluator.Evaluate(recipe, recipe.Positions.ToDictionary(p => p.Name, p => p.Nominal));
            Assert.All(checks, o =>
                Assert.True(
                    double.IsFinite(o.Value) && double.IsFinite(o.WorstCaseError),
                    $"{o.Name} = {o.Value}\n{c}\n{text}"
                )
            );
        }
        else
        {
            Assert.InRange(recipe.MatchTolerancePpm, 1e-3, 1e5);
        }
    }

    // Lines of the text as YAML counts them: CR LF, CR, LF, NEL, LS and PS all end a line (YAML 1.1 sec. 5.4);
    // a final line break does not start another line.
    internal static int YamlLineCount(string text)
    {
        var lines = text.Length > 0 && text[^1] is '\r' or '\n' or '\u0085' or '\u2028' or '\u2029' ? 0 : 1;
        for (var i = 0; i < text.Length; i++)
        {
            if (text[i] == '\r' && i + 1 < text.Length && text[i + 1] == '\n')
            {
                continue;
            }

            lines += text[i] is '\r' or '\n' or '\u0085' or '\u2028' or '\u2029' ? 1 : 0;
        }

        return lines;
    }

    // positions[3].nominal -> positions[].nominal, so the statistics count kinds of field rather than list indices.
    private static string Normalise(string path) =>
        System.Text.RegularExpressions.Regex.Replace(path, @"\[\d+\]", "[]");
}

/// <summary>Counts of one fuzz run.</summary>
internal sealed class FuzzStats
{
    public int Total { get; set; }

    public int Loaded { get; set; }

    public int Refused { get; set; }

    public int YamlProblems { get; set; }

    public Dictionary<string, int> Paths { get; } = new(StringComparer.Ordinal);
}
