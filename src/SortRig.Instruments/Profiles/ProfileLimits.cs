using System.Text;
using YamlDotNet.Core;
using YamlDotNet.Core.Events;

namespace SortRig.Instruments.Profiles;

/// <summary>
/// What a meter profile file may be, checked before it is parsed: a regular file of at most
/// <see cref="MaxBytes"/> (256 KiB; the shipped profiles are a few kB), nested at most <see cref="MaxDepth"/>
/// levels of mappings and lists (a profile needs three). A bigger file, a device (e.g. /dev/zero) or deeper
/// nesting is refused with the usual file:line:col error instead of exhausting memory or the stack.
/// </summary>
public static class ProfileLimits
{
    /// <summary>Largest profile, in bytes (UTF-8). 256 KiB.</summary>
    public const int MaxBytes = 256 * 1024;

    /// <summary>Deepest nesting of mappings and lists. 16.</summary>
    public const int MaxDepth = 16;

    /// <summary>Reads at most <see cref="MaxBytes"/> of a regular file.</summary>
    /// <exception cref="ProfileException">The file is larger, or is not a regular file.</exception>
    public static string Read(string path)
    {
        var info = new FileInfo(path);
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
        var buffer = new byte[MaxBytes + 1];
        var total = 0;
        int read;
        while (total < buffer.Length && (read = stream.Read(buffer, total, buffer.Length - total)) > 0)
        {
            total += read;
        }

        if (total > MaxBytes)
        {
            // A size of 0 that still yields data is a device or a pipe, not a profile file.
            throw info.Length == 0
                ? new ProfileException(path, 1, 1, string.Empty, "is not a regular file", "a profile file (YAML)")
                : new ProfileException(
                    path,
                    1,
                    1,
                    string.Empty,
                    $"is over {MaxBytes} bytes",
                    $"a profile of at most {MaxBytes} bytes"
                );
        }

        var bom = total >= 3 && buffer[0] == 0xEF && buffer[1] == 0xBB && buffer[2] == 0xBF ? 3 : 0;
        return Encoding.UTF8.GetString(buffer, bom, total - bom);
    }

    /// <summary>Refuses text over <see cref="MaxBytes"/> or nested deeper than <see cref="MaxDepth"/>, naming
    /// where.</summary>
    public static void Check(string yaml, string file)
    {
        if (Encoding.UTF8.GetByteCount(yaml) > MaxBytes)
        {
            throw new ProfileException(
                file,
                1,
                1,
                string.Empty,
                $"is over {MaxBytes} bytes",
                $"a profile of at most {MaxBytes} bytes"
            );
        }

        // Only YamlDotNet's document model recurses; its event parser does not, so the depth is counted on events.
        var parser = new Parser(new StringReader(yaml));
        var depth = 0;
        try
        {
            while (parser.MoveNext())
            {
                depth += parser.Current switch
                {
                    MappingStart or SequenceStart => 1,
                    MappingEnd or SequenceEnd => -1,
                    _ => 0,
                };
                if (depth > MaxDepth)
                {
                    var at = parser.Current!.Start;
                    throw new ProfileException(
                        file,
                        (int)at.Line,
                        (int)at.Column,
                        string.Empty,
                        $"nests more than {MaxDepth} levels",
                        $"mappings and lists nested at most {MaxDepth} deep"
                    );
                }
            }
        }
        catch (Exception e) when (e is YamlException or InvalidOperationException or ArgumentException)
        {
            // Malformed text: the loader's own parse reports it with its position.
        }
    }
}
