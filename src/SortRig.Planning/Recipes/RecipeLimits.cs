using System.Text;
using YamlDotNet.Core;
using YamlDotNet.Core.Events;

namespace SortRig.Planning.Recipes;

/// <summary>
/// What a recipe file may be, checked before it is parsed: a regular file of at most <see cref="MaxBytes"/>
/// (1 MiB; the largest shipped recipe is a few kB), nested at most <see cref="MaxDepth"/> levels of mappings and
/// lists (a recipe needs four). A bigger file, a device or pipe, or deeper nesting is refused with the usual
/// file:line:col error instead of exhausting memory or the stack.
/// </summary>
public static class RecipeLimits
{
    /// <summary>Largest recipe file or text, in bytes (UTF-8). 1 MiB.</summary>
    public const int MaxBytes = 1 << 20;

    /// <summary>Deepest nesting of mappings and lists. 32.</summary>
    public const int MaxDepth = 32;

    /// <summary>Reads at most <see cref="MaxBytes"/> of a regular file.</summary>
    /// <exception cref="RecipeException">The file is larger, or is not a regular file.</exception>
    public static async Task<string> ReadAsync(string path, CancellationToken cancellationToken)
    {
        var info = new FileInfo(path);
        if (!info.Exists)
        {
            throw new FileNotFoundException($"{path}: no such recipe file", path);
        }

        await using var stream = new FileStream(
            path,
            FileMode.Open,
            FileAccess.Read,
            FileShare.Read,
            16_384,
            FileOptions.Asynchronous
        );
        var buffer = new byte[MaxBytes + 1];
        var total = 0;
        int read;
        while (
            total < buffer.Length
            && (read = await stream.ReadAsync(buffer.AsMemory(total), cancellationToken).ConfigureAwait(false)) > 0
        )
        {
            total += read;
        }

        if (total > MaxBytes)
        {
            // A size of 0 that still yields data is a device or a pipe (e.g. /dev/zero), not a recipe file.
            var what = info.Length == 0 ? "a regular file" : $"a recipe of at most {MaxBytes} bytes (1 MiB)";
            throw new RecipeException(path, 1, 1, RecipeLoader.Document, what);
        }

        // as File.ReadAllText
        var bom = total >= 3 && buffer[0] == 0xEF && buffer[1] == 0xBB && buffer[2] == 0xBF ? 3 : 0;
        return Encoding.UTF8.GetString(buffer, bom, total - bom);
    }

    /// <summary>Refuses text over <see cref="MaxBytes"/> or nested deeper than <see cref="MaxDepth"/>, naming
    /// where.</summary>
    /// <exception cref="RecipeException">The text is too large or too deep.</exception>
    public static void Check(string yaml, string fileName)
    {
        if (Encoding.UTF8.GetByteCount(yaml) > MaxBytes)
        {
            throw new RecipeException(
                fileName,
                1,
                1,
                RecipeLoader.Document,
                $"a recipe of at most {MaxBytes} bytes (1 MiB)"
            );
        }

        // The event parser keeps its own stack; only the document model recurses, so count depth on events first.
        var parser = new Parser(new StringReader(yaml));
        var depth = 0;
        try
        {
            while (parser.MoveNext())
            {
                if (parser.Current is MappingStart or SequenceStart && ++depth > MaxDepth)
                {
                    var at = parser.Current.Start;
                    throw new RecipeException(
                        fileName,
                        (int)at.Line,
                        (int)at.Column,
                        RecipeLoader.Document,
                        $"mappings and lists nested at most {MaxDepth} deep"
                    );
                }

                if (parser.Current is MappingEnd or SequenceEnd)
                {
                    depth--;
                }
            }
        }
        catch (Exception e) when (e is YamlException or InvalidOperationException or ArgumentException)
        {
            // Malformed text: the loader's own parse reports it with its position.
        }
    }
}
