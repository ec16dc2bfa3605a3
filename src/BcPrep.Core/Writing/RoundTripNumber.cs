using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;

namespace BcPrep.Writing;

/// <summary>
/// Writes a double in exactly the characters of <c>value.ToString("R", CultureInfo.InvariantCulture)</c>, about five
/// times faster: `calibrate` writes tens of millions of numbers a day, and the runtime's shortest round-trip
/// conversion (about 200 ns a number) cost more than ten times the parsing of the day.
/// </summary>
/// <remarks>
/// Digits: the shortest decimal that reads back to the same double, the closest to it when several are that short,
/// ties to the even digit; a decimal on the edge of the rounding interval counts when the significand is even (the
/// reader rounds half to even). This is the runtime's choice too. Method: Giulietti's "Schubfach" (The Schubfach
/// way to render doubles, 2020): one 64 × 126-bit product with the power of ten, rounded to odd, gives the
/// scaled value and both interval ends exactly enough to compare; our own code, with the table of powers of ten
/// computed at start-up from exact integers.
/// Layout, as the runtime writes "R": digits d₁…dₙ with the decimal point at position p (value = 0.d₁…dₙ × 10^p);
/// plain notation when −3 ≤ p ≤ 17 (the runtime's limit for shortest digits, found by trying it: 1E+17 but
/// 10000000000000000), otherwise d₁.d₂…dₙE±XX (at least two exponent digits); "-0" for
/// negative zero. Subnormals and powers of two (other than integers) are rare enough to be left to the
/// runtime's own conversion, whose digits for powers of two differ (see <see cref="Format"/>). The tests compare with the runtime on tens
/// of millions of random and edge values.
/// </remarks>
public static class RoundTripNumber
{
    /// <summary>Characters enough for any finite double ("-2.2250738585072014E-308" is 24).</summary>
    public const int MaxChars = 26;

    private const int KMin = -324;
    private const int KMax = 292;
    private const long CMin = 1L << 52;
    private const long Mask63 = long.MaxValue;

    /// <summary>⌈10⁻ᵏ · 2⁻ʳ⌉ style 126-bit approximations (floor + 1), split into 63-bit halves, index k − KMin.</summary>
    private static readonly long[] G1;
    private static readonly long[] G0;

    private static ReadOnlySpan<byte> TwoDigits => "00010203040506070809101112131415161718192021222324252627282930313233343536373839404142434445464748495051525354555657585960616263646566676869707172737475767778798081828384858687888990919293949596979899"u8;

    static RoundTripNumber()
    {
        G1 = new long[KMax - KMin + 1];
        G0 = new long[KMax - KMin + 1];
        var mask63 = (BigInteger.One << 63) - 1;
        for (var k = KMin; k <= KMax; k++)
        {
            // 10^-k = β·2^r with 2^125 ≤ β < 2^126, r = ⌊log2 10^-k⌋ − 125; g = ⌊β⌋ + 1.
            var r = FloorLog2Pow10(-k) - 125;
            BigInteger g;
            if (k <= 0)
            {
                var p = BigInteger.Pow(10, -k);
                g = r >= 0 ? p >> r : p << -r;
            }
            else
            {
                g = (BigInteger.One << -r) / BigInteger.Pow(10, k);
            }
            g += 1;
            G1[k - KMin] = (long)(g >> 63);
            G0[k - KMin] = (long)(g & mask63);
        }
    }

    /// <summary>Formats <paramref name="value"/> into <paramref name="destination"/> (room for <see cref="MaxChars"/>); returns the characters written.</summary>
    /// <exception cref="ArgumentException">NaN or an infinity (they have no round-trip digits here).</exception>
    public static int Format(double value, Span<char> destination)
    {
        var bits = BitConverter.DoubleToInt64Bits(value);
        var t = bits & ((1L << 52) - 1);
        var bq = (int)((bits >>> 52) & 0x7FF);
        if (bq == 0x7FF)
        {
            throw new ArgumentException("NaN and infinities have no round-trip digits.", nameof(value));
        }
        if (bq == 0)
        {
            if (t == 0)
            {
                return Zero(bits < 0, destination);
            }
            // Subnormal: the runtime's own conversion (never seen in measured data).
            value.TryFormat(destination, out var written, "R", CultureInfo.InvariantCulture);
            return written;
        }
        var negative = bits < 0;
        var mq = 1075 - bq;
        var c = CMin | t;
        if (mq > 0 && mq < 53)
        {
            var f = c >> mq;
            if (f << mq == c)
            {
                return Layout(negative, f, 0, destination);
            }
        }
        if (t == 0)
        {
            // A power of two: its rounding interval is narrower below than above, and the runtime's digits there
            // are not always the shortest (nor always read back: 2^-958 is written 4.104536801298376E-289). Its
            // own conversion keeps the output the same.
            value.TryFormat(destination, out var written, "R", CultureInfo.InvariantCulture);
            return written;
        }
        var (digits, exponent) = Shortest(-mq, c);
        return Layout(negative, digits, exponent, destination);
    }

    /// <summary>Shortest decimal d·10^e in the rounding interval of c·2^q (normal doubles).</summary>
    private static (long Digits, int Exponent) Shortest(int q, long c)
    {
        var odd = (int)c & 1;
        var cb = c << 2;
        var cbr = cb + 2;
        long cbl;
        int k;
        if (c != CMin || q == -1074)
        {
            cbl = cb - 2;
            k = FloorLog10Pow2(q);
        }
        else
        {
            // A power of two: the interval below is half as wide as above.
            cbl = cb - 1;
            k = FloorLog10ThreeQuartersPow2(q);
        }
        var h = q + FloorLog2Pow10(-k) + 2;
        var g1 = G1[k - KMin];
        var g0 = G0[k - KMin];
        var vb = RoundToOdd(g1, g0, cb << h);
        var vbl = RoundToOdd(g1, g0, cbl << h);
        var vbr = RoundToOdd(g1, g0, cbr << h);
        var s = vb >> 2;
        if (s >= 100)
        {
            // One digit fewer than s, when exactly one multiple of ten lies in the interval.
            var sp10 = 10 * (s / 10);
            var tp10 = sp10 + 10;
            var upin = vbl + odd <= sp10 << 2;
            var wpin = (tp10 << 2) + odd <= vbr;
            if (upin != wpin)
            {
                return (upin ? sp10 : tp10, k);
            }
        }
        var tt = s + 1;
        var uin = vbl + odd <= s << 2;
        var win = (tt << 2) + odd <= vbr;
        if (uin != win)
        {
            return (uin ? s : tt, k);
        }
        var cmp = vb - ((s + tt) << 1);
        return (cmp < 0 || (cmp == 0 && (s & 1) == 0) ? s : tt, k);
    }

    /// <summary>⌊g·cp / 2^127⌋ with its lowest bit set when the rest is not zero (round to odd).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static long RoundToOdd(long g1, long g0, long cp)
    {
        var x1 = (long)Math.BigMul((ulong)g0, (ulong)cp, out _);
        var y1 = (long)Math.BigMul((ulong)g1, (ulong)cp, out var y0Unsigned);
        var y0 = (long)y0Unsigned;
        var z = (long)((ulong)y0 >> 1) + x1;
        var vbp = y1 + (long)((ulong)z >> 63);
        return vbp | (long)((ulong)((z & Mask63) + Mask63) >> 63);
    }

    private static int FloorLog10Pow2(int e) => (int)((e * 661_971_961_083L) >> 41);

    private static int FloorLog10ThreeQuartersPow2(int e) => (int)(((e * 661_971_961_083L) - 274_743_187_321L) >> 41);

    private static int FloorLog2Pow10(int e) => (e * 1_741_647) >> 19;

    private static int Zero(bool negative, Span<char> destination)
    {
        if (negative)
        {
            destination[0] = '-';
            destination[1] = '0';
            return 2;
        }
        destination[0] = '0';
        return 1;
    }

    /// <summary>The runtime's general layout of digits·10^exponent (trailing zeros dropped first).</summary>
    private static int Layout(bool negative, long digits, int exponent, Span<char> destination)
    {
        while (digits % 10 == 0)
        {
            digits /= 10;
            exponent++;
        }
        Span<char> text = stackalloc char[20];
        var n = WriteDigits((ulong)digits, text);
        var d = text[(20 - n)..];
        var pos = 0;
        if (negative)
        {
            destination[pos++] = '-';
        }
        var point = n + exponent;
        if (point > 17 || point < -3)
        {
            destination[pos++] = d[0];
            if (n > 1)
            {
                destination[pos++] = '.';
                d[1..].CopyTo(destination[pos..]);
                pos += n - 1;
            }
            destination[pos++] = 'E';
            var e = point - 1;
            destination[pos++] = e < 0 ? '-' : '+';
            e = Math.Abs(e);
            if (e >= 100)
            {
                destination[pos++] = (char)('0' + (e / 100));
                e %= 100;
            }
            destination[pos++] = (char)('0' + (e / 10));
            destination[pos++] = (char)('0' + (e % 10));
            return pos;
        }
        if (point <= 0)
        {
            destination[pos++] = '0';
            destination[pos++] = '.';
            for (var i = point; i < 0; i++)
            {
                destination[pos++] = '0';
            }
            d.CopyTo(destination[pos..]);
            return pos + n;
        }
        if (point >= n)
        {
            d.CopyTo(destination[pos..]);
            pos += n;
            for (var i = n; i < point; i++)
            {
                destination[pos++] = '0';
            }
            return pos;
        }
        d[..point].CopyTo(destination[pos..]);
        pos += point;
        destination[pos++] = '.';
        d[point..].CopyTo(destination[pos..]);
        return pos + n - point;
    }

    /// <summary>Writes the decimal digits of <paramref name="v"/> right-aligned into the 20-character buffer; returns how many.</summary>
    private static int WriteDigits(ulong v, Span<char> text)
    {
        // At most 17 digits: the low eight in 32-bit arithmetic, then the rest (cheaper than 64-bit divisions).
        var i = 20;
        if (v >= 100_000_000)
        {
            var high = v / 100_000_000;
            WriteEight((uint)(v - (high * 100_000_000)), text[(i - 8)..i]);
            i -= 8;
            v = high;
            if (v >= 100_000_000)
            {
                high = v / 100_000_000;
                WriteEight((uint)(v - (high * 100_000_000)), text[(i - 8)..i]);
                i -= 8;
                v = high;
            }
        }
        var pairs = TwoDigits;
        var w = (uint)v;
        while (w >= 100)
        {
            var q = w / 100;
            var r = (int)(w - (q * 100));
            w = q;
            text[--i] = (char)pairs[(2 * r) + 1];
            text[--i] = (char)pairs[2 * r];
        }
        if (w >= 10)
        {
            text[--i] = (char)pairs[(2 * (int)w) + 1];
            text[--i] = (char)pairs[2 * (int)w];
        }
        else
        {
            text[--i] = (char)('0' + (int)w);
        }
        return 20 - i;
    }

    /// <summary>Exactly eight digits of <paramref name="v"/> (&lt; 10^8), leading zeros included.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void WriteEight(uint v, Span<char> eight)
    {
        var pairs = TwoDigits;
        var high = v / 10_000;
        var low = v - (high * 10_000);
        var a = (int)(high / 100);
        var b = (int)(high - ((uint)a * 100));
        var c = (int)(low / 100);
        var d = (int)(low - ((uint)c * 100));
        eight[0] = (char)pairs[2 * a];
        eight[1] = (char)pairs[(2 * a) + 1];
        eight[2] = (char)pairs[2 * b];
        eight[3] = (char)pairs[(2 * b) + 1];
        eight[4] = (char)pairs[2 * c];
        eight[5] = (char)pairs[(2 * c) + 1];
        eight[6] = (char)pairs[2 * d];
        eight[7] = (char)pairs[(2 * d) + 1];
    }
}
