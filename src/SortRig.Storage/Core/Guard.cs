namespace SortRig.Storage.Core;

/// <summary>Argument checks that name the field and its valid range.</summary>
internal static class Guard
{
    public const int MaxTextLength = 200;
    public const int MaxIdsPerCall = 10_000;

    public static void Positive(double value, string field)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(field, value, $"{field} must be a finite number > 0.");
        }
    }

    public static void NonNegative(double value, string field)
    {
        if (!double.IsFinite(value) || value < 0)
        {
            throw new ArgumentOutOfRangeException(field, value, $"{field} must be a finite number >= 0.");
        }
    }

    public static void Finite(double value, string field)
    {
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(field, value, $"{field} must be a finite number.");
        }
    }

    public static void FiniteOrNull(double? value, string field)
    {
        if (value is double v)
        {
            Finite(v, field);
        }
    }

    public static void Text(string? value, string field)
    {
        if (string.IsNullOrWhiteSpace(value) || value.Length > MaxTextLength)
        {
            throw new ArgumentException($"{field} must be 1..{MaxTextLength} characters, not blank.", field);
        }
    }

    public static void TextOrNull(string? value, string field)
    {
        if (value is not null)
        {
            Text(value, field);
        }
    }

    public static void Id(long id, string field)
    {
        if (id <= 0)
        {
            throw new ArgumentOutOfRangeException(field, id, $"{field} must be a database id > 0.");
        }
    }

    /// <summary>Checks an id list and returns it without duplicates, in ascending order.</summary>
    public static IReadOnlyList<long> Ids(IReadOnlyList<long> ids, string field)
    {
        ArgumentNullException.ThrowIfNull(ids, field);
        if (ids.Count is 0 or > MaxIdsPerCall)
        {
            throw new ArgumentException($"{field} must hold 1..{MaxIdsPerCall} part ids, not {ids.Count}.", field);
        }

        foreach (var id in ids)
        {
            Id(id, field);
        }

        return ids.Distinct().Order().ToArray();
    }
}
