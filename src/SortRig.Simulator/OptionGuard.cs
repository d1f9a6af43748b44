namespace SortRig.Simulator;

/// <summary>Validation helpers that name the option and its valid range in the error.</summary>
internal static class OptionGuard
{
    public static void InRange(double value, double min, double max, string option, string unit = "")
    {
        if (!double.IsFinite(value) || value < min || value > max)
        {
            throw new ArgumentOutOfRangeException(
                option,
                value,
                $"{option} must be between {min} and {max}{Unit(unit)}; was {value}."
            );
        }
    }

    public static void InRange(int value, int min, int max, string option)
    {
        if (value < min || value > max)
        {
            throw new ArgumentOutOfRangeException(
                option,
                value,
                $"{option} must be between {min} and {max}; was {value}."
            );
        }
    }

    public static void InRange(TimeSpan value, TimeSpan min, TimeSpan max, string option)
    {
        if (value < min || value > max)
        {
            throw new ArgumentOutOfRangeException(
                option,
                value,
                $"{option} must be between {min} and {max}; was {value}."
            );
        }
    }

    public static void Ordered(double low, double high, string lowOption, string highOption)
    {
        if (low > high)
        {
            throw new ArgumentException($"{lowOption} ({low}) must not exceed {highOption} ({high}).", lowOption);
        }
    }

    public static void Ordered(TimeSpan low, TimeSpan high, string lowOption, string highOption)
    {
        if (low > high)
        {
            throw new ArgumentException($"{lowOption} ({low}) must not exceed {highOption} ({high}).", lowOption);
        }
    }

    public static void NotNull(object? value, string option)
    {
        if (value is null)
        {
            throw new ArgumentNullException(option, $"{option} is required.");
        }
    }

    private static string Unit(string unit) => unit.Length == 0 ? string.Empty : " " + unit;
}
