using System.ComponentModel.DataAnnotations;
using System.Globalization;
using System.Reflection;
using Microsoft.Extensions.Configuration;
using SortRig.Engine.Sorting;
using SortRig.Instruments.Resources;
using SortRig.Storage;

namespace SortRig.Host.Cli;

/// <summary>
/// Checks the sort verb's settings before anything starts (no meter, no database, no page), so a
/// bad value is one line naming the flag as the user typed it (or the setting, when it came from
/// appsettings.json or a SORTRIG_ variable) and what is allowed.
/// </summary>
internal static partial class SortInputCheck
{
    /// <summary>The bound options, or the one-line problem.</summary>
    public static (SortOptions? Options, string? Problem) Bind(IConfiguration configuration, FlagMap? flags)
    {
        var section = configuration.GetSection(SortOptions.Section);
        foreach (var property in typeof(SortOptions).GetProperties())
        {
            var type = Nullable.GetUnderlyingType(property.PropertyType) ?? property.PropertyType;
            if (
                type.IsEnum
                && section[property.Name] is { } text
                && (!Enum.TryParse(type, text, ignoreCase: true, out _) || int.TryParse(text, out _))
            )
            {
                var allowed = string.Join(", ", Enum.GetNames(type).Select(n => n.ToLowerInvariant()));
                return (null, $"{Name(property, flags)}: '{text}' is not one of {allowed}");
            }
        }

        SortOptions options;
        try
        {
            options = section.Get<SortOptions>() ?? new SortOptions();
        }
        catch (InvalidOperationException e)
        {
            // Only a setting from a file or the environment gets here: flags are parsed by type already.
            return (null, $"{SortOptions.Section} settings: {(e.InnerException ?? e).Message}");
        }

        var results = new List<ValidationResult>();
        if (!Validator.TryValidateObject(options, new ValidationContext(options), results, validateAllProperties: true))
        {
            return (null, Describe(results[0], options, flags));
        }

        try
        {
            PrecisionLogFactory.CheckTarget(options.Database);
        }
        catch (ArgumentException e)
        {
            return (null, $"{Name(nameof(SortOptions.Database), flags)}: {e.Message}");
        }
        catch (Storage.Contracts.StorageException e) when (e.Fault == Storage.Contracts.StorageFault.Unavailable)
        {
            return (null, $"{Name(nameof(SortOptions.Database), flags)}: {e.Message}");
        }

        if (VerbSupport.TextArg.Problem(options.Session, Name(nameof(SortOptions.Session), flags)) is { } badName)
        {
            return (null, badName);
        }

        foreach (var typedOnly in (string[])[nameof(SortOptions.Agree), nameof(SortOptions.Gap)])
        {
            if (section[typedOnly] is not null && !ResourceStringParser.IsTyped(options.Resource))
            {
                return (null, $"{Name(typedOnly, flags)}: applies to a typed meter (--resource TYPED::profile) only");
            }
        }

        if (!string.IsNullOrWhiteSpace(options.Resource))
        {
            try
            {
                ResourceStringParser.Parse(options.Resource);
            }
            catch (ResourceStringException e)
            {
                return (null, $"{Name(nameof(SortOptions.Resource), flags)}: {e.Message}");
            }

            if (TypedInputCheck.Problem(options, Name(nameof(SortOptions.Resource), flags)) is { } typedProblem)
            {
                return (null, typedProblem);
            }

            if (section[nameof(SortOptions.Physics)] is not null)
            {
                return (
                    null,
                    $"{Name(nameof(SortOptions.Physics), flags)}: applies to the simulator only; a real meter "
                        + $"measures real parts"
                );
            }

            if (options.Speed != 1)
            {
                return (
                    null,
                    $"{Name(nameof(SortOptions.Speed), flags)}: applies to the simulator only; a real meter runs in "
                        + $"real time"
                );
            }
        }

        if (CheckCheck(options, section, flags) is { } badCheck)
        {
            return (null, badCheck);
        }

        if (CheckBuild(options, flags) is { } badBuild)
        {
            return (null, badBuild);
        }

        return (options, null);
    }

    // The check standard: its text must name one; the cadence and value flags need it; a cadence must be given.
    private static string? CheckCheck(SortOptions options, IConfigurationSection section, FlagMap? flags)
    {
        if (string.IsNullOrWhiteSpace(options.Check))
        {
            foreach (
                var member in (string[])
                    [nameof(SortOptions.CheckEvery), nameof(SortOptions.CheckMinutes), nameof(SortOptions.CheckValue)]
            )
            {
                if (section[member] is not null)
                {
                    return $"{Name(member, flags)}: applies only with a check standard ("
                        + $"{Name(nameof(SortOptions.Check), flags)})";
                }
            }

            return null;
        }

        try
        {
            _ = Engine.Checking.CheckSource.Parse(options.Check, options.CheckValue);
        }
        catch (FormatException e)
        {
            return $"{Name(nameof(SortOptions.Check), flags)}: {e.Message}";
        }

        return options.CheckEvery == 0 && options.CheckMinutes == 0
            ? $"{Name(nameof(SortOptions.CheckEvery), flags)}: 0 with no "
                + $"{Name(nameof(SortOptions.CheckMinutes), flags)} would read the check only at the start and the "
                + $"end; give one of them"
            : null;
    }

    private static string Describe(ValidationResult result, SortOptions options, FlagMap? flags)
    {
        var member = result.MemberNames.FirstOrDefault();
        var property = member is null ? null : typeof(SortOptions).GetProperty(member);
        if (property is null)
        {
            return result.ErrorMessage ?? "invalid sort settings";
        }

        var value = Convert.ToString(property.GetValue(options), CultureInfo.InvariantCulture);
        return property.GetCustomAttribute<RangeAttribute>() is { } range
            ? string.Create(
                CultureInfo.InvariantCulture,
                $"{Name(property, flags)}: {value} is out of range; allowed {range.Minimum} to {range.Maximum}"
            )
            : $"{Name(property, flags)}: {result.ErrorMessage}";
    }

    private static string Name(PropertyInfo property, FlagMap? flags) => Name(property.Name, flags);

    private static string Name(string member, FlagMap? flags)
    {
        var key = $"{SortOptions.Section}:{member}";
        return flags?.FlagFor(key) ?? $"{key} (SORTRIG_{SortOptions.Section}__{member})";
    }
}
