using MathNet.Numerics.Random;

namespace SortRig.Simulator.Faults;

/// <summary>
/// Decides when a fault happens: one-shot faults armed by <see cref="Inject"/> (or the side channel)
/// fire at the next opportunity; random faults fire at their rate, from a seeded stream.
/// Reply faults (drop, delay, garble) need a reply; message faults (spurious error, silent reset)
/// fire before the next program message runs; the reading fault (not a number) needs a reading reply. Every fault that
/// fires is counted in <see cref="Log"/>.
/// </summary>
public sealed class FaultInjector
{
    private static readonly FaultKind[] s_replyKinds =
    [
        FaultKind.DropConnection,
        FaultKind.DelayReply,
        FaultKind.GarbleReply,
    ];
    private static readonly FaultKind[] s_messageKinds = [FaultKind.SpuriousError, FaultKind.SilentReset];

    private readonly Lock _gate = new();
    private readonly Random _rng;
    private readonly int[] _armed = new int[Enum.GetValues<FaultKind>().Length];
    private readonly double[] _rates;
    private TimeSpan _replyDelay;

    internal FaultInjector(FaultOptions options, int seed)
    {
        options.Validate();
        _rng = new MersenneTwister(seed, threadSafe: false);
        _rates = Enum.GetValues<FaultKind>().Select(options.RateOf).ToArray();
        _replyDelay = options.ReplyDelay;
        SerialSilence = options.SerialSilence;
    }

    /// <summary>Counts of injected faults by kind.</summary>
    public FaultLog Log { get; } = new();

    /// <summary>How long a delayed reply is held back; 0 to 10 min.</summary>
    public TimeSpan ReplyDelay
    {
        get
        {
            lock (_gate)
            {
                return _replyDelay;
            }
        }
        set
        {
            OptionGuard.InRange(value, TimeSpan.Zero, TimeSpan.FromMinutes(10), nameof(ReplyDelay));
            lock (_gate)
            {
                _replyDelay = value;
            }
        }
    }

    /// <summary>How long serial stays silent after a drop.</summary>
    public TimeSpan SerialSilence { get; }

    /// <summary>Arms one fault of this kind for the next opportunity (next reply, or next message).</summary>
    public void Inject(FaultKind kind)
    {
        lock (_gate)
        {
            _armed[(int)kind]++;
        }
    }

    /// <summary>Sets the random rate of one kind, 0 to 1 per message.</summary>
    public void SetRate(FaultKind kind, double probability)
    {
        OptionGuard.InRange(probability, 0, 1, $"{kind} rate");
        lock (_gate)
        {
            _rates[(int)kind] = probability;
        }
    }

    /// <summary>The current random rate of one kind.</summary>
    public double Rate(FaultKind kind)
    {
        lock (_gate)
        {
            return _rates[(int)kind];
        }
    }

    /// <summary>Message faults that fire before the next program message runs (counted).</summary>
    internal IReadOnlyList<FaultKind> TakeMessageFaults() => s_messageKinds.Where(Fires).ToArray();

    /// <summary>At most one reply fault for the reply about to be sent (counted), or null.</summary>
    internal FaultKind? TakeReplyFault() => s_replyKinds.Cast<FaultKind?>().FirstOrDefault(k => Fires(k!.Value));

    /// <summary>True when the reading reply about to be formed is to carry not-a-number values (counted).</summary>
    internal bool TakeReadingFault() => Fires(FaultKind.NotANumber);

    /// <summary>Flips one to three characters, or cuts the reply short (at least one character goes).</summary>
    internal string Garble(string reply)
    {
        lock (_gate)
        {
            if (reply.Length > 1 && _rng.NextDouble() < 0.5)
            {
                return reply[.._rng.Next(0, reply.Length - 1)];
            }

            var chars = reply.ToCharArray();
            var flips = _rng.Next(1, 4);
            for (var i = 0; i < flips && chars.Length > 0; i++)
            {
                var at = _rng.Next(chars.Length);
                chars[at] = (char)('!' + ((((chars[at] - '!' + _rng.Next(1, 94)) % 94) + 94) % 94));
            }

            return chars.Length == 0 ? "#" : new string(chars);
        }
    }

    private bool Fires(FaultKind kind)
    {
        lock (_gate)
        {
            var fire = _armed[(int)kind] > 0;
            if (fire)
            {
                _armed[(int)kind]--;
            }
            else if (_rates[(int)kind] > 0)
            {
                fire = _rng.NextDouble() < _rates[(int)kind];
            }

            if (fire)
            {
                Log.Record(kind);
            }

            return fire;
        }
    }
}
