using System.Globalization;
using BcPrep.Cli.Output;

namespace BcPrep.Tests.Cli.Output;

/// <summary>
/// The CSV writer formats numbers into its own buffer; each cell must be exactly what ToString("R") with the invariant
/// culture gives (the round-trip form DEVELOPERS.md promises), whatever the current culture and the row length.
/// </summary>
public sealed class CsvOutputTests
{
    [Fact]
    public void Every_number_is_written_as_its_invariant_round_trip_string_and_parses_back_to_the_same_double()
    {
        var values = new List<double>
        {
            0.0, -0.0, 1.0, -1.0, 0.1, 1.0 / 3.0, 293.15, 1234.5670000000002, 1e15, 1e16, 1.2345678901234567e-5, 1e-5, 1e-4,
            double.Epsilon, -double.Epsilon, double.MaxValue, double.MinValue, 2.2250738585072014e-308, 123456789012345680000.0,
        };
        var random = new Random(19);
        for (var i = 0; i < 20_000; i++)
        {
            values.Add(BitConverter.Int64BitsToDouble(random.NextInt64()) is var bits && double.IsFinite(bits) ? bits : random.NextDouble());
            values.Add(290.0 + (10.0 * random.NextDouble()));
            values.Add(i * 0.001);
        }
        var text = new StringWriter();
        var csv = new CsvOutput(text);
        csv.Header(["a", "b", "c"]);
        for (var i = 0; i + 3 <= values.Count; i += 3)
        {
            csv.Number(values[i]);
            csv.Number(values[i + 1]);
            csv.Number(values[i + 2]);
            csv.EndRow();
        }
        csv.Flush();

        var cells = text.ToString().TrimEnd('\n').Split('\n').Skip(1).SelectMany(l => l.Split(',')).ToList();
        Assert.Equal(values.Count / 3 * 3, cells.Count);
        for (var i = 0; i < cells.Count; i++)
        {
            Assert.Equal(values[i].ToString("R", CultureInfo.InvariantCulture), cells[i]);
            Assert.Equal(BitConverter.DoubleToInt64Bits(values[i]), BitConverter.DoubleToInt64Bits(double.Parse(cells[i], CultureInfo.InvariantCulture)));
        }
    }

    [Fact]
    public void A_decimal_comma_culture_changes_nothing_and_non_finite_values_are_empty_cells()
    {
        var previous = CultureInfo.CurrentCulture;
        try
        {
            // Invariant globalization cannot create de-DE itself; this clone has its decimal comma and '.' grouping.
            var comma = (CultureInfo)CultureInfo.InvariantCulture.Clone();
            comma.NumberFormat.NumberDecimalSeparator = ",";
            comma.NumberFormat.NumberGroupSeparator = ".";
            CultureInfo.CurrentCulture = comma;
            Assert.Equal("1,5", 1.5.ToString(CultureInfo.CurrentCulture));
            var text = new StringWriter();
            var csv = new CsvOutput(text);
            csv.Header(["x", "y, quoted", "z"]);
            csv.Number(1.5);
            csv.Number(double.NaN);
            csv.Number(-2.25e-7);
            csv.EndRow();
            csv.Flush();
            Assert.Equal("x,\"y, quoted\",z\n1.5,,-2.25E-07\n", text.ToString());
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
        }
    }

    [Fact]
    public void Rows_longer_than_the_buffer_grow_it_and_lose_nothing()
    {
        var text = new StringWriter();
        var csv = new CsvOutput(text);
        var columns = Enumerable.Range(0, 5000).Select(i => "c" + i.ToString(CultureInfo.InvariantCulture)).ToList();
        csv.Header(columns);
        for (var i = 0; i < columns.Count; i++)
        {
            csv.Number(-1.7976931348623157E+308);
        }
        csv.EndRow();
        csv.Flush();
        var lines = text.ToString().TrimEnd('\n').Split('\n');
        Assert.Equal(string.Join(',', columns), lines[0]);
        Assert.Equal(string.Join(',', Enumerable.Repeat("-1.7976931348623157E+308", columns.Count)), lines[1]);
    }

    [Fact]
    public void Rows_formatted_in_parts_on_several_threads_are_written_in_order_as_if_written_directly()
    {
        var random = new Random(5);
        var rows = Enumerable.Range(0, 5000).Select(i => new[] { i * 0.001, 290.0 + random.NextDouble(), -random.NextDouble() }).ToArray();
        var direct = new StringWriter();
        var one = new CsvOutput(direct);
        one.Header(["t", "a", "b"]);
        foreach (var r in rows)
        {
            one.Number(r[0]);
            one.Number(r[1]);
            one.Number(r[2]);
            one.EndRow();
        }
        one.Flush();

        var inParts = new StringWriter();
        var csv = new CsvOutput(inParts);
        csv.Header(["t", "a", "b"]);
        var parts = Enumerable.Range(0, 3).Select(_ => csv.Part()).ToArray();
        Parallel.For(0, parts.Length, p =>
        {
            for (var i = p * 2000; i < Math.Min(rows.Length, (p + 1) * 2000); i++)
            {
                parts[p].Number(rows[i][0]);
                parts[p].Number(rows[i][1]);
                parts[p].Number(rows[i][2]);
                parts[p].EndRow();
            }
        });
        foreach (var part in parts)
        {
            csv.Write(part);
        }
        csv.Flush();
        Assert.Equal(direct.ToString(), inParts.ToString());
    }

    private static void WriteSample(CsvOutput csv, bool whole)
    {
        csv.Header(["time [s]", "t_in [°C]", "say \"x\""]);
        var random = new Random(31);
        for (var i = 0; i < 30_000; i++)
        {
            double[] row = [i * 0.001, 290.0 + random.NextDouble(), i % 7 == 0 ? double.NaN : -random.NextDouble() * 1e-5];
            if (whole)
            {
                csv.Row(row);
            }
            else
            {
                csv.Number(row[0]);
                csv.Number(row[1]);
                csv.Number(row[2]);
                csv.EndRow();
            }
            if (i % 4096 == 0)
            {
                csv.Flush();
            }
        }
        csv.Flush();
    }

    [Fact]
    public void A_utf8_stream_writer_gets_the_same_bytes_after_what_it_already_holds_and_whole_rows_equal_cell_by_cell()
    {
        // Standard output's writer (UTF-8, no byte-order mark) takes the rows' bytes straight into its stream; text
        // written to the writer itself before must still come first. Any other writer gets the same characters.
        var text = new StringWriter { NewLine = "\n" };
        text.Write("before\n");
        WriteSample(new CsvOutput(text), whole: false);

        var bytes = new MemoryStream();
        var writer = new StreamWriter(bytes, new System.Text.UTF8Encoding(false), 1 << 16) { NewLine = "\n" };
        writer.Write("before\n");
        WriteSample(new CsvOutput(writer), whole: true);
        writer.Flush();

        Assert.Contains("t_in [°C]", text.ToString(), StringComparison.Ordinal);
        Assert.Equal(System.Text.Encoding.UTF8.GetBytes(text.ToString()), bytes.ToArray());
    }

    [Fact]
    public void A_writer_with_a_byte_order_mark_keeps_it()
    {
        var bytes = new MemoryStream();
        var writer = new StreamWriter(bytes, new System.Text.UTF8Encoding(true));
        var csv = new CsvOutput(writer);
        csv.Header(["a"]);
        csv.Row([1.5]);
        csv.Flush();
        writer.Flush();

        Assert.Equal([0xEF, 0xBB, 0xBF, (byte)'a', (byte)'\n', (byte)'1', (byte)'.', (byte)'5', (byte)'\n'], bytes.ToArray());
    }

    [Fact]
    public void A_whole_row_of_the_wrong_width_is_refused()
    {
        var csv = new CsvOutput(new StringWriter());
        csv.Header(["a", "b"]);
        Assert.Throws<InvalidOperationException>(() => csv.Row([1.0]));
        csv.Number(1.0);
        Assert.Throws<InvalidOperationException>(() => csv.Row([1.0, 2.0]));
    }
}
