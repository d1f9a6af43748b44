namespace SortRig.Planning.Cups;

/// <summary>Options of <see cref="SlotAssigner"/>: trays of rows × columns (a strip is one row). Validated at
/// construction.</summary>
public sealed record SlotOptions
{
    /// <summary>Creates validated options.</summary>
    /// <param name="trays">Number of trays, 1 to 99, default 1.</param>
    /// <param name="rows">Rows per tray, lettered A.., 1 to 26, default 10 (1 for a strip).</param>
    /// <param name="columns">Columns per tray, 1 to 99, default 10.</param>
    /// <param name="nominals">Nominals accepted (ohms); null accepts every nominal.</param>
    public SlotOptions(int trays = 1, int rows = 10, int columns = 10, IReadOnlyList<double>? nominals = null)
    {
        Trays = trays is >= 1 and <= 99
            ? trays
            : throw new ArgumentOutOfRangeException(nameof(trays), trays, "Trays must be 1 to 99");
        Rows = rows is >= 1 and <= 26
            ? rows
            : throw new ArgumentOutOfRangeException(nameof(rows), rows, "Rows must be 1 to 26");
        Columns = columns is >= 1 and <= 99
            ? columns
            : throw new ArgumentOutOfRangeException(nameof(columns), columns, "Columns must be 1 to 99");
        Nominals = nominals;
    }

    /// <summary>Trays (1–99).</summary>
    public int Trays { get; }

    /// <summary>Rows per tray (1–26).</summary>
    public int Rows { get; }

    /// <summary>Columns per tray (1–99).</summary>
    public int Columns { get; }

    /// <summary>Accepted nominals, or null for all.</summary>
    public IReadOnlyList<double>? Nominals { get; }

    /// <summary>Total slots.</summary>
    public int Capacity => Trays * Rows * Columns;

    /// <summary>Label of slot <paramref name="index"/>: tray, row letter, two-digit column, e.g. "T1-A07".</summary>
    public string Label(int index)
    {
        var perTray = Rows * Columns;
        var inTray = index % perTray;
        return $"T{(index / perTray) + 1}-{(char)('A' + (inTray / Columns))}{(inTray % Columns) + 1:00}";
    }
}
