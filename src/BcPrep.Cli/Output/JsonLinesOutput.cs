using System.Buffers;
using System.Text;
using System.Text.Json;

namespace BcPrep.Cli.Output;

/// <summary>
/// JSON lines: one compact object per row, keys = column names in header order, numbers in shortest round-trip
/// form, a missing or non-finite value as null; see <see cref="TabularOutput"/>.
/// </summary>
public sealed class JsonLinesOutput : TabularOutput
{
    private readonly TextWriter _output;
    private readonly ArrayBufferWriter<byte> _buffer = new(1 << 16);
    private readonly Utf8JsonWriter _json;
    private JsonEncodedText[] _keys = [];
    private int _cell = -1;

    public JsonLinesOutput(TextWriter output)
    {
        _output = output;
        _json = new Utf8JsonWriter(_buffer, new JsonWriterOptions { Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping });
    }

    public override void Header(IReadOnlyList<string> columns) => _keys = columns.Select(c => JsonEncodedText.Encode(c)).ToArray();

    public override void Number(double value)
    {
        Key();
        if (double.IsFinite(value))
        {
            _json.WriteNumberValue(value);
        }
        else
        {
            _json.WriteNullValue();
        }
    }

    public override void Text(string value)
    {
        Key();
        _json.WriteStringValue(value);
    }

    public override void Empty()
    {
        Key();
        _json.WriteNullValue();
    }

    public override void EndRow()
    {
        if (_cell + 1 != _keys.Length)
        {
            throw new InvalidOperationException($"a row has {_cell + 1} cells but the header has {_keys.Length}");
        }
        if (_cell < 0)
        {
            _json.WriteStartObject();
        }
        _json.WriteEndObject();
        _json.Flush();
        // Each object is a separate JSON document; resetting keeps the writer from inserting a comma.
        _json.Reset();
        _buffer.Write("\n"u8);
        _cell = -1;
        if (_buffer.WrittenCount > 1 << 16)
        {
            Flush();
        }
    }

    public override void Flush()
    {
        _json.Flush();
        _output.Write(Encoding.UTF8.GetString(_buffer.WrittenSpan));
        _buffer.Clear();
    }

    private void Key()
    {
        if (_cell < 0)
        {
            _json.WriteStartObject();
        }
        _cell++;
        if (_cell >= _keys.Length)
        {
            throw new InvalidOperationException($"a row has more cells than the header's {_keys.Length}");
        }
        _json.WritePropertyName(_keys[_cell]);
    }
}
