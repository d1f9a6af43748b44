namespace SortRig.Simulator.Meter;

/// <summary>The mutable configuration of the meter and scanner routing, behind one lock.</summary>
internal sealed class MeterState
{
    private readonly Lock _gate = new();
    private MeterSettings _settings = MeterSettings.Default;
    private int? _closedChannel;
    private IReadOnlyList<int> _scanList = [];

    public MeterSettings Settings
    {
        get
        {
            lock (_gate)
            {
                return _settings;
            }
        }
    }

    /// <summary>The one closed scanner channel, or null when the front fixture is measured.</summary>
    public int? ClosedChannel
    {
        get
        {
            lock (_gate)
            {
                return _closedChannel;
            }
        }
        set
        {
            lock (_gate)
            {
                _closedChannel = value;
            }
        }
    }

    /// <summary>Channels that INITiate / READ? step through; empty for no scan.</summary>
    public IReadOnlyList<int> ScanList
    {
        get
        {
            lock (_gate)
            {
                return _scanList;
            }
        }
        set
        {
            lock (_gate)
            {
                _scanList = value;
            }
        }
    }

    public MeterSettings Update(Func<MeterSettings, MeterSettings> change)
    {
        lock (_gate)
        {
            _settings = change(_settings);
            return _settings;
        }
    }

    /// <summary>Autorange bookkeeping: moves the active function's range when autorange is still on.</summary>
    public void AutoRanged(MeterFunction function, double range) =>
        Update(s => s.For(function).AutoRange ? s.With(function, s.For(function) with { Range = range }) : s);

    /// <summary>*RST: default settings, all channels open, no scan list.</summary>
    public void Reset()
    {
        lock (_gate)
        {
            _settings = MeterSettings.Default;
            _closedChannel = null;
            _scanList = [];
        }
    }
}
