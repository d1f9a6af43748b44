using SortRig.Engine.Composition;
using SortRig.Instruments.Typed;
using SortRig.Measurement.Specs;

namespace SortRig.Engine.Typed;

/// <summary>Finds a typed-meter profile by family name under instruments/typed/, or by file path.</summary>
public static class TypedProfileLocator
{
    /// <summary>Loads the profile; throws <see cref="FileNotFoundException"/> listing where it looked.</summary>
    public static DisplayMeterSpec Load(string nameOrPath)
    {
        ArgumentNullException.ThrowIfNull(nameOrPath);
        if (File.Exists(nameOrPath))
        {
            return TypedProfileLoader.Load(nameOrPath);
        }

        var fileName = nameOrPath.EndsWith(".yaml", StringComparison.OrdinalIgnoreCase)
            ? nameOrPath
            : nameOrPath + ".yaml";
        var folders = ProfileLocator.SearchFolders.Select(f => Path.Combine(f, "typed")).ToList();
        foreach (var folder in folders)
        {
            var candidate = Path.Combine(folder, fileName);
            if (File.Exists(candidate))
            {
                return TypedProfileLoader.Load(candidate);
            }
        }

        throw new FileNotFoundException(
            $"No typed-meter profile '{nameOrPath}': no {fileName} in {string.Join(" or ", folders)}.",
            nameOrPath
        );
    }
}
