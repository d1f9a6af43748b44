using System.Text.RegularExpressions;

namespace SortRig.Storage.Lab;

/// <summary>
/// Names of the lab's roles and schema on a shared PostgreSQL server (docs/lab.md). Each must be a plain lower-case
/// SQL identifier (letters, digits, underscore; 1..63 characters, not starting with a digit), so it can be written
/// into DDL without quoting.
/// </summary>
/// <param name="Owner">Owns the schema and runs the migrations. Default sortrig_owner.</param>
/// <param name="Writer">What benches log in as: reads and writes rows, cannot change the schema. Default
/// sortrig_writer.</param>
/// <param name="Schema">The schema that holds the tables. Default sortrig.</param>
public sealed partial record LabRoleNames(
    string Owner = "sortrig_owner",
    string Writer = "sortrig_writer",
    string Schema = "sortrig"
)
{
    /// <summary>Throws <see cref="ArgumentException"/> naming the first field that is not a plain identifier, or when
    /// owner and writer are the same role.</summary>
    public void Validate()
    {
        Check(Owner, nameof(Owner));
        Check(Writer, nameof(Writer));
        Check(Schema, nameof(Schema));
        if (Owner == Writer)
        {
            throw new ArgumentException($"Owner and Writer must be different roles (both '{Owner}').", nameof(Writer));
        }
    }

    /// <summary>Throws <see cref="ArgumentException"/> naming <paramref name="field"/> when the value is not a plain
    /// identifier.</summary>
    internal static void Check(string value, string field)
    {
        if (value is null || !Identifier().IsMatch(value))
        {
            throw new ArgumentException(
                $"{field}: '{value}' is not a plain identifier (a-z, 0-9, _; 1..63 characters, not starting with a "
                    + $"digit).",
                field
            );
        }
    }

    [GeneratedRegex("^[a-z_][a-z0-9_]{0,62}$", RegexOptions.CultureInvariant)]
    private static partial Regex Identifier();
}
