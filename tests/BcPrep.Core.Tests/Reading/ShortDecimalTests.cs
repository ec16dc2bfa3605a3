using System.Globalization;
using System.Text;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Reading;

/// <summary>
/// The reader's fast path for plain decimals must give the bits of the general parsers it stands in front of
/// (.NET's double.Parse, correctly rounded per IEEE 754-2008 §5.12, and CsvHelper's TryParse behind it in
/// LogFileReader), and must leave every other text to them.
/// </summary>
public class ShortDecimalTests
{
    private static double Bits(string text, char separator = '.')
    {
        Assert.True(ShortDecimal.TryParse(Encoding.UTF8.GetBytes(text), (byte)separator, out var value), text);
        return value;
    }

    private static void SameBitsAsDoubleParse(string text)
    {
        var expected = double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);
        Assert.Equal(BitConverter.DoubleToInt64Bits(expected), BitConverter.DoubleToInt64Bits(Bits(text)));
    }

    [Theory]
    // Values of the shapes a logger writes; the expected bits are double.Parse's (correctly rounded).
    [InlineData("3.10741")]
    [InlineData("-0.1091")]
    [InlineData("109.3507")]
    [InlineData("0.1")] // not a binary fraction: the division must round it as the parser does
    [InlineData("0.3")]
    [InlineData("2.675")]
    [InlineData("42")]
    [InlineData("007.50")]
    [InlineData("999999999999999")] // 15 digits: the largest mantissa taken
    [InlineData("0.00000000000001")] // the most fraction digits taken
    [InlineData("-999999.999999999")]
    [InlineData("123456.789012345")]
    public void Gives_the_bits_of_double_parse(string text) => SameBitsAsDoubleParse(text);

    [Fact]
    public void Gives_the_bits_of_double_parse_on_random_plain_decimals()
    {
        // Common practice: a seeded sweep over every split of up to 15 digits between integer and fraction.
        var random = new Random(19);
        var text = new StringBuilder();
        for (var t = 0; t < 200_000; t++)
        {
            text.Clear();
            if (random.Next(2) == 0)
            {
                text.Append('-');
            }
            var integerDigits = random.Next(1, 16);
            var fractionDigits = random.Next(0, 16 - integerDigits);
            for (var i = 0; i < integerDigits; i++)
            {
                text.Append((char)('0' + random.Next(10)));
            }
            if (fractionDigits > 0)
            {
                text.Append('.');
                for (var i = 0; i < fractionDigits; i++)
                {
                    text.Append((char)('0' + random.Next(10)));
                }
            }
            SameBitsAsDoubleParse(text.ToString());
        }
    }

    [Fact]
    public void Keeps_the_sign_of_a_negative_zero()
    {
        // .NET Core 3.0 and later parse "-0" as −0 (IEEE 754 keeps the sign); the fast path must too.
        Assert.Equal(BitConverter.DoubleToInt64Bits(-0.0), BitConverter.DoubleToInt64Bits(Bits("-0.0000")));
        Assert.Equal(BitConverter.DoubleToInt64Bits(-0.0), BitConverter.DoubleToInt64Bits(Bits("-0")));
    }

    [Fact]
    public void Reads_a_decimal_comma_when_that_is_the_separator()
    {
        Assert.Equal(1.25, Bits("1,25", ','));
        Assert.False(ShortDecimal.TryParse("1.25"u8, (byte)',', out _));
    }

    [Theory]
    [InlineData("")]
    [InlineData("-")]
    [InlineData(".")]
    [InlineData(".5")]
    [InlineData("5.")]
    [InlineData("+1.5")]
    [InlineData(" 1.5")]
    [InlineData("1.5 ")]
    [InlineData("1.2.3")]
    [InlineData("1e3")]
    [InlineData("-2.5E-1")]
    [InlineData("NaN")]
    [InlineData("Infinity")]
    [InlineData("1,5")]
    [InlineData("\"1.5\"")]
    [InlineData("1234567890123456")] // 16 digits: past 2^53 possible, left to the general parser
    [InlineData("0.000000000000001")] // 16 digits with the leading zeros
    [InlineData("--1")]
    public void Leaves_every_other_text_to_the_general_parser(string text) =>
        Assert.False(ShortDecimal.TryParse(Encoding.UTF8.GetBytes(text), (byte)'.', out _), text);

    [Fact]
    public void The_reader_gives_the_same_values_through_either_path()
    {
        // Plain cells take the fast path, the others (exponent, plus sign, 16 digits, padding) the general one; each
        // value is what double.Parse gives for the cell.
        using var files = new TempFiles();
        string[] cells = ["-0.1091", "1.5e-3", "+2.25", "1234567890.1234567", " 7.5", "0.1", "-0"];
        var path = files.Write("mixed.csv", "t,a\n" + string.Join("", cells.Select((c, i) => $"{i},{c}\n")));
        using var reader = new LogFileReader(LogInput.FromPath(path), new LogFormat("t", TimeFormat.Seconds, null, '.'), ["a"]);
        var block = new LogBlock(1, 16);
        Assert.True(reader.ReadBlock(block));
        Assert.Equal(cells.Length, block.Count);
        for (var i = 0; i < cells.Length; i++)
        {
            var expected = double.Parse(cells[i], NumberStyles.Float, CultureInfo.InvariantCulture);
            Assert.Equal(BitConverter.DoubleToInt64Bits(expected), BitConverter.DoubleToInt64Bits(block.Columns[0][i]));
        }
    }
}
