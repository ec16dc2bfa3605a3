using System.IO.Compression;
using System.Text;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Reading;

public class LogFileReaderTests
{
    private static readonly LogFormat Seconds = new("t", TimeFormat.Seconds, null, '.');

    private static (double[] Time, double[][] Columns) ReadAll(string path, LogFormat format, params string[] columns)
    {
        using var reader = new LogFileReader(LogInput.FromPath(path), format, columns);
        var block = new LogBlock(columns.Length, 3); // small blocks exercise block boundaries
        var time = new List<double>();
        var values = columns.Select(_ => new List<double>()).ToArray();
        while (reader.ReadBlock(block))
        {
            for (var i = 0; i < block.Count; i++)
            {
                time.Add(block.TimeS[i]);
                for (var c = 0; c < columns.Length; c++)
                {
                    values[c].Add(block.Columns[c][i]);
                }
            }
        }
        return (time.ToArray(), values.Select(v => v.ToArray()).ToArray());
    }

    [Fact]
    public void Reads_comma_separated_columns_by_name_across_blocks()
    {
        using var files = new TempFiles();
        var path = files.Write("a.csv", "t,a,b\n0,1.5,10\n0.5,2.5,20\n1.0,3.5,30\n1.5,4.5,40\n2.0,,50\n");
        var (time, columns) = ReadAll(path, Seconds, "b", "a");
        Assert.Equal([0, 0.5, 1.0, 1.5, 2.0], time);
        Assert.Equal([10, 20, 30, 40, 50], columns[0]);
        Assert.Equal(3.5, columns[1][2]);
        Assert.True(double.IsNaN(columns[1][4])); // empty cell is a gap, not zero
    }

    [Fact]
    public void Reads_semicolon_with_decimal_comma_BOM_and_CRLF()
    {
        using var files = new TempFiles();
        var path = files.Write("eu.csv", "t;a\r\n0;1,25\r\n1;-2,5e-1\r\n", bom: true);
        var (time, columns) = ReadAll(path, Seconds with { DecimalSeparator = ',' }, "a");
        Assert.Equal([0.0, 1.0], time);
        Assert.Equal([1.25, -0.25], columns[0]);
    }

    [Fact]
    public void Reads_gzip_by_content_and_tab_separator()
    {
        using var files = new TempFiles();
        using var memory = new MemoryStream();
        using (var gz = new GZipStream(memory, CompressionLevel.Fastest, leaveOpen: true))
        {
            gz.Write(Encoding.UTF8.GetBytes("t\ta\n0\t7\n1\t8\n"));
        }
        var path = files.WriteBytes("day.csv.gz", memory.ToArray());
        var (_, columns) = ReadAll(path, Seconds with { Separator = '\t' }, "a");
        Assert.Equal([7.0, 8.0], columns[0]);
    }

    [Fact]
    public void Reads_ISO_8601_timestamps_as_seconds_since_epoch()
    {
        using var files = new TempFiles();
        var path = files.Write("iso.csv", "stamp,a\n2026-11-24T09:00:00.000,1\n2026-11-24T09:00:00.500,2\n");
        var (time, _) = ReadAll(path, new LogFormat("stamp", TimeFormat.Iso8601, ',', '.'), "a");
        var expected = new DateTimeOffset(2026, 11, 24, 9, 0, 0, TimeSpan.Zero).ToUnixTimeSeconds();
        Assert.Equal(expected, time[0], 6);
        Assert.Equal(0.5, time[1] - time[0], 9);
    }

    [Theory]
    [InlineData("t,a\n0,1\n1,x\n", 3, 2, "'x' is not a number")]
    [InlineData("t,a\n0,1\n1,2,3\n", 3, null, "3 fields but the header has 2")]
    [InlineData("t,a\n0,1\n0,2\n", 3, 1, "repeats")]
    [InlineData("t,a\n1,1\n0,2\n", 3, 1, "goes back")]
    [InlineData("t,a\n0,1\n1,Infinity\n", 3, 2, "infinite")]
    [InlineData("t,a\n0,1\n\n1,oops\n", 4, 2, "not a number")]
    public void Bad_rows_name_file_line_and_column(string text, int line, int? column, string fragment)
    {
        using var files = new TempFiles();
        var path = files.Write("bad.csv", text);
        var failure = Assert.Throws<BcPrepFailure>(() => ReadAll(path, Seconds, "a"));
        Assert.Equal(FailureKind.InputData, failure.Kind);
        var problem = Assert.Single(failure.Problems);
        Assert.Equal(path, problem.Location.File);
        Assert.Equal(line, problem.Location.Line);
        Assert.Equal(column, problem.Location.Column);
        Assert.Contains(fragment, problem.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("", "empty")]
    [InlineData("x,a\n0,1\n", "no time column 't'")]
    [InlineData("t,b\n0,1\n", "'a' named in the rig file is not in the header")]
    public void Bad_headers_are_reported(string text, string fragment)
    {
        using var files = new TempFiles();
        var path = files.Write("h.csv", text);
        var failure = Assert.Throws<BcPrepFailure>(() => ReadAll(path, Seconds, "a"));
        Assert.Contains(fragment, Assert.Single(failure.Problems).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_directory_given_as_a_log_is_reported_as_such()
    {
        using var files = new TempFiles();
        var failure = Assert.Throws<BcPrepFailure>(() => ReadAll(files.Root, Seconds, "a"));
        Assert.Contains("directory", failure.Problems[0].Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_huge_line_is_refused_rather_than_buffered()
    {
        using var files = new TempFiles();
        var path = files.Write("huge.csv", "t,a\n0,1\n1,\"" + new string('9', LogFileReader.MaxRecordBytes * 3) + "\n");
        var failure = Assert.Throws<BcPrepFailure>(() => ReadAll(path, Seconds, "a"));
        Assert.Equal(3, failure.Problems[0].Location.Line);
    }

    [Theory]
    [InlineData("t;a\n0;1,5\n", '.', "'1,5' is not a number")]
    [InlineData("t;a\n0;1.5\n", ',', "'1.5' is not a number")]
    [InlineData("t;a\n0;1 000\n", '.', "'1 000' is not a number")]
    public void A_number_in_the_other_decimal_convention_is_refused_not_misread(string text, char decimalSeparator, string fragment)
    {
        using var files = new TempFiles();
        var path = files.Write("dec.csv", text);
        var failure = Assert.Throws<BcPrepFailure>(() => ReadAll(path, Seconds with { Separator = ';', DecimalSeparator = decimalSeparator }, "a"));
        Assert.Contains(fragment, failure.Problems[0].Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("2026-11-24T09:00:00.500", 0.5)]
    [InlineData("2026-11-24 09:00:00.5", 0.5)]
    [InlineData("2026-11-24T09:00:01Z", 1.0)]
    [InlineData("2026-11-24T10:00:01+01:00", 1.0)]
    [InlineData("2026-11-24T08:00:01.25-01:00", 1.25)]
    [InlineData("2026-11-24T09:00:00.0000001", 1e-7)]
    public void ISO_timestamps_parse_to_seconds_with_zone_and_fraction(string text, double secondsAfterNine)
    {
        Assert.True(IsoTimestamp.TryParseSeconds(System.Text.Encoding.UTF8.GetBytes(text), out var seconds));
        var nine = new DateTimeOffset(2026, 11, 24, 9, 0, 0, TimeSpan.Zero).ToUnixTimeSeconds();
        Assert.Equal(secondsAfterNine, seconds - nine, 6);
    }

    [Theory]
    [InlineData("2026-13-24T09:00:00")]
    [InlineData("2026-02-30T09:00:00")]
    [InlineData("yesterday")]
    public void Impossible_ISO_timestamps_are_refused(string text) =>
        Assert.False(IsoTimestamp.TryParseSeconds(System.Text.Encoding.UTF8.GetBytes(text), out _));

    // Reference: the framework's own ISO-8601 parser (DateTimeOffset.Parse, round-trip), stamp by stamp. The in-order
    // parser reuses the previous row's date, hour and minute; the sequence crosses a minute, an hour, a day, a year
    // and a leap day, changes zone inside a minute, and puts impossible stamps between good ones.
    [Fact]
    public void In_order_parsing_equals_parsing_each_stamp_alone()
    {
        string[] stamps =
        [
            "2027-12-31T23:58:59.998", "2027-12-31T23:58:59.999", "2027-12-31T23:59:00", "2027-12-31T23:59:59.5Z",
            "2028-01-01T00:00:00.25", "2028-01-01 00:00:00.5", "2028-02-29T12:30:15+02:00", "2028-02-29T12:30:16-01:30",
            "2028-02-29T12:30:17", "2028-02-29T12:30:61", "2028-02-29T12:30:18.", "2028-02-30T12:30:19", "2028-02-29T12:30:20.0000001",
            " 2028-02-29T12:31:00 ", "2028-02-29T12:31:01Zx",
        ];
        var inOrder = new IsoTimestamp.InOrder();
        foreach (var stamp in stamps)
        {
            var bytes = System.Text.Encoding.UTF8.GetBytes(stamp);
            var alone = IsoTimestamp.TryParseSeconds(bytes, out var expected);
            var ordered = inOrder.TryParseSeconds(bytes, out var actual);

            Assert.Equal(alone, ordered);
            if (alone)
            {
                Assert.Equal(expected, actual);
                var framework = DateTimeOffset.Parse(stamp.Trim(), System.Globalization.CultureInfo.InvariantCulture, System.Globalization.DateTimeStyles.AssumeUniversal);
                Assert.Equal((framework.UtcTicks - DateTimeOffset.UnixEpoch.UtcTicks) / 1e7, actual, 9);
            }
        }
    }

    [Fact]
    public void A_row_more_than_48_h_after_the_first_is_refused_naming_its_line_and_one_just_within_is_read()
    {
        using var files = new TempFiles();
        var within = files.Write("within.csv", "t,a\n0,1\n1,2\n172800,3\n");
        var beyond = files.Write("beyond.csv", "t,a\n0,1\n1,2\n172800.5,3\n");

        Assert.Equal([0.0, 1.0, 172800.0], ReadAll(within, Seconds, "a").Time);
        var failure = Assert.Throws<BcPrepFailure>(() => ReadAll(beyond, Seconds, "a"));
        Assert.Contains("beyond.csv:4:1: t: the time '172800.5' lies 48 h after the file's first row (line 2)", failure.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_header_naming_a_column_twice_is_refused_with_both_columns()
    {
        using var files = new TempFiles();
        var path = files.Write("dup.csv", "t,a,b,a\n0,1,2,3\n");

        var failure = Assert.Throws<BcPrepFailure>(() => ReadAll(path, Seconds, "a"));

        Assert.Contains("dup.csv:1:4: a: 'a' appears twice in the header (columns 2 and 4)", failure.Message, StringComparison.Ordinal);
    }
}
