using System.Text;

namespace SortRig.Instruments.Transports;

/// <summary>Accumulates received bytes and cuts them into terminator-delimited lines.</summary>
internal sealed class LineBuffer
{
    private readonly byte[] _terminator;
    private readonly bool _trimCarriageReturn;
    private readonly int _maxLineLength;
    private byte[] _bytes = new byte[1024];
    private int _count;

    public LineBuffer(string terminator, int maxLineLength)
    {
        _terminator = Encoding.ASCII.GetBytes(terminator);
        _trimCarriageReturn = terminator == "\n";
        _maxLineLength = maxLineLength;
    }

    /// <summary>Bytes held that do not yet form a complete line.</summary>
    public int Count => _count;

    /// <summary>True when more than the longest allowed line is held with no terminator.</summary>
    public bool IsOverfull => _count > _maxLineLength + _terminator.Length;

    public void Append(ReadOnlySpan<byte> data)
    {
        if (_count + data.Length > _bytes.Length)
        {
            Array.Resize(ref _bytes, Math.Max(_bytes.Length * 2, _count + data.Length));
        }

        data.CopyTo(_bytes.AsSpan(_count));
        _count += data.Length;
    }

    public bool TryTakeLine(out string line)
    {
        var at = _bytes.AsSpan(0, _count).IndexOf(_terminator);
        if (at < 0)
        {
            line = string.Empty;
            return false;
        }

        var length = at;
        if (_trimCarriageReturn && length > 0 && _bytes[length - 1] == (byte)'\r')
        {
            length--;
        }

        line = Encoding.Latin1.GetString(_bytes, 0, length);
        var consumed = at + _terminator.Length;
        _bytes.AsSpan(consumed, _count - consumed).CopyTo(_bytes);
        _count -= consumed;
        return true;
    }

    public void Clear() => _count = 0;
}
