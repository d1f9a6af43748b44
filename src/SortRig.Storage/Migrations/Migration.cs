using System.Globalization;
using System.Reflection;

namespace SortRig.Storage.Migrations;

/// <summary>One schema migration script. Applied in one transaction together with its schema_version row.</summary>
/// <param name="Version">Version reached after the script, from 1, ascending without gaps.</param>
/// <param name="Name">Short name (from the file name).</param>
/// <param name="Sql">Statements separated by semicolons, no transaction control of their own.</param>
internal sealed record Migration(int Version, string Name, string Sql);

/// <summary>Loads the migration scripts embedded for an engine ("sqlite/0001_initial.sql").</summary>
internal static class MigrationCatalog
{
    public static IReadOnlyList<Migration> Load(string engine)
    {
        var assembly = typeof(MigrationCatalog).Assembly;
        var prefix = engine + "/";
        var migrations = assembly
            .GetManifestResourceNames()
            .Where(n => n.StartsWith(prefix, StringComparison.Ordinal) && n.EndsWith(".sql", StringComparison.Ordinal))
            .Select(n => Parse(assembly, n, prefix))
            .OrderBy(m => m.Version)
            .ToArray();
        for (int i = 0; i < migrations.Length; i++)
        {
            if (migrations[i].Version != i + 1)
            {
                throw new InvalidOperationException(
                    $"Migration scripts for {engine} must be numbered 1, 2, 3 ... without gaps; found "
                        + $"{migrations[i].Version} at position {i + 1}."
                );
            }
        }

        return migrations;
    }

    private static Migration Parse(Assembly assembly, string resource, string prefix)
    {
        var file = resource[prefix.Length..^".sql".Length];
        var underscore = file.IndexOf('_', StringComparison.Ordinal);
        if (
            underscore <= 0
            || !int.TryParse(file[..underscore], NumberStyles.None, CultureInfo.InvariantCulture, out int version)
        )
        {
            throw new InvalidOperationException($"Migration script {resource} must be named NNNN_name.sql.");
        }

        using var stream = assembly.GetManifestResourceStream(resource)!;
        using var reader = new StreamReader(stream);
        return new Migration(version, file[(underscore + 1)..], reader.ReadToEnd());
    }
}
