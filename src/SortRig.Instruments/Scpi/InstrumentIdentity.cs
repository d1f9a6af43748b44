namespace SortRig.Instruments.Scpi;

/// <summary>
/// The four fields of an IEEE 488.2 *IDN? reply (sec. 10.14): manufacturer, model, serial
/// number ("0" when not given) and firmware level ("0" when not given).
/// </summary>
public sealed record InstrumentIdentity(string Manufacturer, string Model, string Serial, string Firmware)
{
    /// <summary>Parses a *IDN? reply; white space around fields is trimmed, extra commas stay in Firmware.</summary>
    /// <exception cref="ScpiResponseException">Fewer than four fields, or an empty model field.</exception>
    public static InstrumentIdentity Parse(string reply, string command = "*IDN?")
    {
        var fields = reply.Split(',', 4, StringSplitOptions.TrimEntries);
        if (fields.Length < 4 || fields[1].Length == 0)
        {
            throw new ScpiResponseException(
                command,
                reply,
                "four comma-separated fields: manufacturer,model,serial,firmware"
            );
        }

        return new InstrumentIdentity(fields[0], fields[1], fields[2], fields[3]);
    }

    /// <inheritdoc/>
    public override string ToString() => $"{Manufacturer} {Model} s/n {Serial} fw {Firmware}";
}
