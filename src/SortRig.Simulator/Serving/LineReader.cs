using System.Text;

namespace SortRig.Simulator.Serving;

/// <summary>What arrived on the wire: a whole line, an over-long line, or an unterminated tail at end of
/// input.</summary>
internal enum InboundKind
{
    Line = 0,
    Overrun = 1,
    Unterminated = 2,
}

internal readonly record struct Inbound(InboundKind Kind, string Text);

/// <summary>Splits a byte stream into lines at LF (a preceding CR is dropped). Lines over <see cref="MaxLine"/> bytes
/// are reported as overruns.</summary>
internal sealed class LineReader
{
    public const int MaxLine = 4096;

    private readonly Stream _stream;
    private readonly byte[] _buffer = new byte[1024];
    private readonly List<byte> _line = [];
    private int _offset;
    private int _count;
    private bool _overrun;

    public LineReader(Stream stream) => _stream = stream;

    /// <summary>The next inbound item, or null at end of input.</summary>
    public async Task<Inbound?> ReadAsync(CancellationToken ct)
    {
        while (true)
        {
            while (_offset < _count)
            {
                var b = _buffer[_offset++];
                if (b == (byte)'\n')
                {
                    var item = _overrun
                        ? new Inbound(InboundKind.Overrun, string.Empty)
                        : new Inbound(InboundKind.Line, Text());
                    _overrun = false;
                    _line.Clear();
                    return item;
                }

                if (_line.Count < MaxLine)
                {
                    _line.Add(b);
                }
                else
                {
                    _overrun = true;
                }
            }

            _offset = 0;
            _count = await _stream.ReadAsync(_buffer, ct).ConfigureAwait(false);
            if (_count == 0)
            {
                var tail = _line.Count > 0 ? new Inbound(InboundKind.Unterminated, Text()) : (Inbound?)null;
                _line.Clear();
                return tail;
            }
        }
    }

    private string Text() => Encoding.ASCII.GetString([.. _line]).TrimEnd('\r');
}
