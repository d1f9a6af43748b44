namespace SortRig.Measurement.Control;

/// <summary>Options of the EWMA chart for slow drift. Each property is validated when set.</summary>
public sealed record EwmaOptions
{
    private readonly double _lambda = 0.2;
    private readonly double _width = 3.0;

    /// <summary>The default options (lambda 0.2, L 3).</summary>
    public static EwmaOptions Default { get; } = new();

    /// <summary>Weight of the newest point, lambda. Default 0.2; valid (0, 1].</summary>
    public double Lambda
    {
        get => _lambda;
        init =>
            _lambda = value is > 0 and <= 1
                ? value
                : throw new ArgumentOutOfRangeException(nameof(Lambda), value, "Lambda must be in (0, 1].");
    }

    /// <summary>Width of the limits in sigmas of the EWMA statistic, L. Default 3; valid [1, 6].</summary>
    public double Width
    {
        get => _width;
        init =>
            _width = value is >= 1 and <= 6
                ? value
                : throw new ArgumentOutOfRangeException(nameof(Width), value, "Width must be in [1, 6].");
    }
}
