using System.Globalization;
using System.Text.Json;
using BcPrep.Cli.Output;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>--json: JSON lines with the same columns and numbers as the CSV form; the shared TabularOutput writers.</summary>
public sealed class JsonOutputTests
{
    [Fact]
    public void Calibrate_json_lines_carry_the_same_columns_and_numbers_as_the_csv()
    {
        var csv = CliRunner.Run("calibrate", SampleDay.Rig, SampleDay.Morning);
        var json = CliRunner.Run("calibrate", "--json", SampleDay.Rig, SampleDay.Morning);

        Assert.Equal(0, csv.ExitCode);
        Assert.Equal(0, json.ExitCode);
        Assert.Equal("", json.Error);
        var csvLines = csv.Out.TrimEnd('\n').Split('\n');
        var jsonLines = json.Out.TrimEnd('\n').Split('\n');
        Assert.Equal(9601, csvLines.Length);
        Assert.Equal(csvLines.Length - 1, jsonLines.Length);
        var header = csvLines[0].Split(',');
        Assert.Equal("time [s]", header[0]);
        Assert.Equal("p_baro [Pa]", header[1]);
        foreach (var row in new[] { 0, 1, 4321, 9599 })
        {
            using var document = JsonDocument.Parse(jsonLines[row]);
            var properties = document.RootElement.EnumerateObject().ToList();
            Assert.Equal(header, properties.Select(p => p.Name));
            var cells = csvLines[row + 1].Split(',');
            for (var c = 0; c < header.Length; c++)
            {
                Assert.Equal(double.Parse(cells[c], CultureInfo.InvariantCulture), properties[c].Value.GetDouble());
            }
        }
    }

    [Fact]
    public void Csv_output_quotes_cells_with_separators_and_leaves_non_finite_numbers_empty()
    {
        var writer = new StringWriter();
        var output = TabularOutput.Create(writer, json: false);

        output.Header(["name", "value [Pa]"]);
        output.Text("say \"hi\", then go");
        output.Number(0.1);
        output.EndRow();
        output.Text("plain");
        output.Number(double.NaN);
        output.EndRow();
        output.Flush();

        Assert.Equal("name,value [Pa]\n\"say \"\"hi\"\", then go\",0.1\nplain,\n", writer.ToString());
    }

    [Fact]
    public void Json_lines_write_one_object_per_row_with_null_for_missing_and_round_trip_numbers()
    {
        var writer = new StringWriter();
        var output = TabularOutput.Create(writer, json: true);

        output.Header(["time [s]", "p [Pa]", "note"]);
        output.Number(0.1);
        output.Number(1.0 / 3.0);
        output.Text("a \"quoted\" note");
        output.EndRow();
        output.Number(1e-300);
        output.Empty();
        output.Number(double.PositiveInfinity);
        output.EndRow();
        output.Flush();

        var lines = writer.ToString().Split('\n');
        Assert.Equal(3, lines.Length);
        Assert.Equal("", lines[2]);
        Assert.Equal("{\"time [s]\":0.1,\"p [Pa]\":0.3333333333333333,\"note\":\"a \\\"quoted\\\" note\"}", lines[0]);
        Assert.Equal("{\"time [s]\":1E-300,\"p [Pa]\":null,\"note\":null}", lines[1]);
        Assert.Equal(1.0 / 3.0, JsonDocument.Parse(lines[0]).RootElement.GetProperty("p [Pa]").GetDouble());
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void A_row_with_the_wrong_number_of_cells_is_refused(bool json)
    {
        var output = TabularOutput.Create(new StringWriter(), json);
        output.Header(["a", "b"]);
        output.Number(1);

        Assert.Throws<InvalidOperationException>(output.EndRow);
    }
}
