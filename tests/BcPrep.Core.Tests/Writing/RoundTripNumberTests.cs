using System.Globalization;
using BcPrep.Writing;

namespace BcPrep.Tests.Writing;

/// <summary>
/// <see cref="RoundTripNumber"/> must write exactly the characters of the runtime's <c>ToString("R", invariant)</c>
/// (the round-trip form the CSV output promises): the reference is the runtime itself, value by value.
/// BCPREP_ROUNDTRIP_MILLIONS raises the count of random values per family (default 1 million each; the branch
/// was checked with 20 million per family, 100 million values in all).
/// </summary>
public sealed class RoundTripNumberTests
{
    private static int Count => int.TryParse(Environment.GetEnvironmentVariable("BCPREP_ROUNDTRIP_MILLIONS"), out var m) ? m * 1_000_000 : 1_000_000;

    private static void AssertSame(double value)
    {
        if (!double.IsFinite(value))
        {
            return; // a neighbour of ±0 or of the largest double, stepped by one bit
        }
        Span<char> buffer = stackalloc char[RoundTripNumber.MaxChars];
        var n = RoundTripNumber.Format(value, buffer);
        var expected = value.ToString("R", CultureInfo.InvariantCulture);
        if (!buffer[..n].SequenceEqual(expected))
        {
            Assert.Fail($"bits 0x{BitConverter.DoubleToInt64Bits(value):X16}: runtime '{expected}', ours '{buffer[..n].ToString()}'");
        }
    }

    [Fact]
    public void Edge_values_are_written_as_the_runtime_writes_them()
    {
        // Where the layout switches (decimal point position −3 and 15, or the digit count), zeros, extremes,
        // powers of two (a narrower interval below) and of ten, and integers near 2^53.
        double[] edges =
        [
            0.0, -0.0, 1.0, -1.0, 0.1, 0.2, 0.3, 1.0 / 3.0, 2.0 / 3.0, 293.15, 1e-5, 1e-4, 9.9999999999999991e-5, 1.2345678901234567e-5,
            0.0001, 0.00012345, 1e14, 1e15, 1e16, 1e17, 123456789012345.0, 1234567890123456.0, 12345678901234567.0,
            999999999999999.0, 9999999999999998.0, 1.5e15, 1.2345678901234567e16, 9007199254740991.0, 9007199254740992.0,
            9007199254740993.0, 18014398509481992.0, 18014398509481990.0, 5e-324, -5e-324, double.MaxValue, double.MinValue,
            2.2250738585072014e-308, 2.2250738585072009e-308, 1.7976931348623157e308, 123456789012345680000.0, 0.5, 0.25,
            4.35, 0.001, 0.0009999275207519531, 98644.46, -2.96875000000002E-05, 1e22, 1e23, 1e-7, 5e-5, 1e300, 1e-300,
        ];
        foreach (var v in edges)
        {
            AssertSame(v);
            AssertSame(-v);
        }
        for (var e = -1074; e <= 1023; e++)
        {
            var p = Math.ScaleB(1.0, e);
            AssertSame(p);
            AssertSame(BitConverter.Int64BitsToDouble(BitConverter.DoubleToInt64Bits(p) + 1));
            AssertSame(BitConverter.Int64BitsToDouble(BitConverter.DoubleToInt64Bits(p) - 1));
        }
        for (var e = -325; e <= 308; e++)
        {
            var p = double.Parse($"1e{e}", CultureInfo.InvariantCulture);
            AssertSame(p);
            AssertSame(BitConverter.Int64BitsToDouble(BitConverter.DoubleToInt64Bits(p) + 1));
            AssertSame(BitConverter.Int64BitsToDouble(BitConverter.DoubleToInt64Bits(p) - 1));
        }
    }

    [Fact]
    public void Random_bit_patterns_are_written_as_the_runtime_writes_them()
    {
        var random = new Random(19);
        for (var i = 0; i < Count; i++)
        {
            var v = BitConverter.Int64BitsToDouble(random.NextInt64(long.MinValue, long.MaxValue));
            if (double.IsFinite(v))
            {
                AssertSame(v);
            }
        }
    }

    [Fact]
    public void Measurement_like_values_are_written_as_the_runtime_writes_them()
    {
        // What `calibrate` writes: times k/f_s, short logged decimals, and their calibrated images (17 digits).
        var random = new Random(20);
        for (var i = 0; i < Count; i++)
        {
            AssertSame(i * 0.001);
            AssertSame(Math.Round(random.NextDouble() * 200_000.0 - 100_000.0, random.Next(0, 7)));
            AssertSame(273.15 + (random.NextDouble() * 100.0));
            AssertSame((random.NextDouble() - 0.5) * Math.Pow(10.0, random.Next(-8, 18)));
        }
    }

    [Fact]
    public void Integers_and_short_decimals_are_written_as_the_runtime_writes_them()
    {
        var random = new Random(21);
        for (var i = 0; i < Count; i++)
        {
            AssertSame(random.NextInt64(-(1L << 60), 1L << 60) >> random.Next(0, 60));
            AssertSame(random.Next(-999_999, 1_000_000) * Math.Pow(10.0, random.Next(-20, 21)));
        }
    }

    [Fact]
    public void Every_digit_count_at_every_decimal_point_position_is_written_as_the_runtime_writes_it()
    {
        // The layout shifts the point into words of eight digits and counts the significant digits from the words:
        // each count 1–17 (trailing zeros in every word), with the point before, inside and after the digits, in
        // plain and exponent form, both signs.
        var random = new Random(22);
        for (var digits = 1; digits <= 17; digits++)
        {
            for (var trial = 0; trial < 200; trial++)
            {
                var text = new char[digits];
                text[0] = (char)('1' + random.Next(9));
                for (var i = 1; i < digits; i++)
                {
                    text[i] = (char)('0' + random.Next(10));
                }
                if (digits > 1)
                {
                    text[^1] = (char)('1' + random.Next(9));
                }
                for (var point = -6; point <= 20; point++)
                {
                    var value = double.Parse($"0.{new string(text)}E{point}", CultureInfo.InvariantCulture);
                    AssertSame(value);
                    AssertSame(-value);
                }
            }
        }
    }

    [Fact]
    public void The_ascii_form_has_the_characters_of_the_text_form_and_stays_inside_its_room()
    {
        var random = new Random(23);
        var bytes = new byte[RoundTripNumber.AsciiRoom + 8];
        var chars = new char[RoundTripNumber.MaxChars];
        for (var i = 0; i < 100_000; i++)
        {
            var value = (i % 2 == 0) ? BitConverter.Int64BitsToDouble(random.NextInt64()) : (random.NextDouble() - 0.5) * Math.Pow(10, random.Next(-8, 20));
            if (!double.IsFinite(value))
            {
                continue;
            }
            Array.Fill(bytes, (byte)0xEE);
            var n = RoundTripNumber.FormatAscii(value, bytes.AsSpan(0, RoundTripNumber.AsciiRoom));
            var m = RoundTripNumber.Format(value, chars);
            Assert.Equal(chars.AsSpan(0, m).ToString(), System.Text.Encoding.ASCII.GetString(bytes, 0, n));
            Assert.All(bytes[RoundTripNumber.AsciiRoom..], b => Assert.Equal(0xEE, b));
        }
        Assert.Throws<ArgumentException>(() => RoundTripNumber.FormatAscii(1.5, new byte[RoundTripNumber.AsciiRoom - 1]));
    }

    [Fact]
    public void Eight_digits_in_one_word_are_the_decimal_digits_leading_zeros_included()
    {
        var random = new Random(24);
        var values = new List<uint> { 0, 1, 9, 10, 99, 100, 999, 1000, 9999, 10_000, 10_001, 99_999, 1_000_000, 12_345_678, 99_999_999 };
        for (var i = 0; i < 200_000; i++)
        {
            values.Add((uint)random.Next(100_000_000));
        }
        Span<byte> word = stackalloc byte[8];
        foreach (var v in values)
        {
            System.Buffers.Binary.BinaryPrimitives.WriteUInt64LittleEndian(word, RoundTripNumber.EightDigits(v));
            Assert.Equal(v.ToString("D8", CultureInfo.InvariantCulture), System.Text.Encoding.ASCII.GetString(word));
        }
    }

    [Fact]
    public void Digit_counts_change_exactly_at_the_powers_of_ten()
    {
        var power = 1UL;
        for (var k = 1; k <= 19; k++)
        {
            power *= 10;
            Assert.Equal(k, RoundTripNumber.DigitCount(power - 1));
            Assert.Equal(k + 1, RoundTripNumber.DigitCount(power));
            Assert.Equal(k + 1, RoundTripNumber.DigitCount(power + 1));
        }
        Assert.Equal(1, RoundTripNumber.DigitCount(1));
        var random = new Random(25);
        for (var i = 0; i < 100_000; i++)
        {
            var v = (ulong)random.NextInt64(1, long.MaxValue) >> random.Next(0, 62);
            v = Math.Max(v, 1);
            Assert.Equal(v.ToString(CultureInfo.InvariantCulture).Length, RoundTripNumber.DigitCount(v));
        }
    }

    [Fact]
    public void Non_finite_values_are_refused()
    {
        var buffer = new char[RoundTripNumber.MaxChars];
        Assert.Throws<ArgumentException>(() => RoundTripNumber.Format(double.NaN, buffer));
        Assert.Throws<ArgumentException>(() => RoundTripNumber.Format(double.PositiveInfinity, buffer));
    }
}
