using SortRig.Instruments.Profiles;

namespace SortRig.Engine.Composition;

/// <summary>Finds a meter profile by file path or by family name under instruments/.</summary>
public static class ProfileLocator
{
    /// <summary>Folders searched for "&lt;name&gt;.yaml", in order.</summary>
    public static IReadOnlyList<string> SearchFolders =>
        [
            Path.Combine(Environment.CurrentDirectory, "instruments"),
            Path.Combine(AppContext.BaseDirectory, "instruments"),
        ];

    /// <summary>Loads the profile; throws <see cref="FileNotFoundException"/> listing where it looked.</summary>
    public static MeterProfile Load(string nameOrPath)
    {
        if (File.Exists(nameOrPath))
        {
            return MeterProfileLoader.Load(nameOrPath);
        }

        var fileName = nameOrPath.EndsWith(".yaml", StringComparison.OrdinalIgnoreCase)
            ? nameOrPath
            : nameOrPath + ".yaml";
        foreach (var folder in SearchFolders)
        {
            var candidate = Path.Combine(folder, fileName);
            if (File.Exists(candidate))
            {
                return MeterProfileLoader.Load(candidate);
            }
        }

        throw new FileNotFoundException(
            $"No meter profile '{nameOrPath}': not a file, and no {fileName} in {string.Join(" or ", SearchFolders)}.",
            nameOrPath
        );
    }
}
