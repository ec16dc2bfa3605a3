using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace BcPrep.Writing;

/// <summary>
/// Writes a double in exactly the characters of <c>value.ToString("R", CultureInfo.InvariantCulture)</c>, several
/// times faster: `calibrate` writes tens of millions of numbers a day, and the runtime's shortest round-trip
/// conversion (about 200 ns a number) cost more than ten times the parsing of the day. On the values of a 1 kHz day's
/// conditioned output this takes about 34 ns a number as ASCII bytes (<see cref="FormatAscii"/>), half the digit
/// search and half the layout.
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
/// runtime's own conversion, whose digits for powers of two differ (see <see cref="FormatAscii"/>). The tests compare with the runtime on tens
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

    /// <summary>
    /// ⌈10⁻ᵏ · 2⁻ʳ⌉ style 126-bit approximations (floor + 1), split into 63-bit halves, the upper half at 2(k − KMin)
    /// and the lower at 2(k − KMin) + 1 (one array, so both halves come from one cache line; k is always in range,
    /// so the look-up is unchecked).
    /// </summary>
    private static readonly long[] G;

    static RoundTripNumber()
    {
        G = new long[2 * (KMax - KMin + 1)];
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
            G[2 * (k - KMin)] = (long)(g >> 63);
            G[(2 * (k - KMin)) + 1] = (long)(g & mask63);
        }
    }

    /// <summary>
    /// Room <see cref="FormatAscii"/> needs in its destination: it moves digits in whole 8-byte words, so it may write
    /// (and later overwrite or leave) bytes up to this far past where it starts; the number itself is at most
    /// <see cref="MaxChars"/>.
    /// </summary>
    public const int AsciiRoom = 64;

    /// <summary>Formats <paramref name="value"/> into <paramref name="destination"/> (room for <see cref="MaxChars"/>); returns the characters written.</summary>
    /// <exception cref="ArgumentException">NaN or an infinity (they have no round-trip digits here).</exception>
    public static int Format(double value, Span<char> destination)
    {
        Span<byte> ascii = stackalloc byte[AsciiRoom];
        var n = FormatAscii(value, ascii);
        for (var i = 0; i < n; i++)
        {
            destination[i] = (char)ascii[i];
        }
        return n;
    }

    /// <summary>
    /// The same characters as <see cref="Format(double, Span{char})"/>, as ASCII bytes (which are their UTF-8 form);
    /// <paramref name="destination"/> must hold <see cref="AsciiRoom"/> bytes. Returns the bytes of the number.
    /// </summary>
    /// <exception cref="ArgumentException">NaN or an infinity, or less room than <see cref="AsciiRoom"/>.</exception>
    public static int FormatAscii(double value, Span<byte> destination)
    {
        if (destination.Length < AsciiRoom)
        {
            throw new ArgumentException($"the destination must hold {AsciiRoom} bytes", nameof(destination));
        }
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
                var m = DigitCount((ulong)f);
                return Layout(negative, (ulong)f * PowersOfTen[17 - m], m, destination);
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
        // 10¹⁵ ≤ digits < 10¹⁷ (see Shortest): 16 or 17 of them, scaled to 17.
        var (digits, exponent) = Shortest(-mq, c);
        var sixteen = digits < 10_000_000_000_000_000L;
        return Layout(negative, (ulong)(sixteen ? digits * 10 : digits), exponent + (sixteen ? 16 : 17), destination);
    }

    /// <summary>
    /// Shortest decimal d·10^e in the rounding interval of c·2^q: normal doubles that are not powers of two (those
    /// go to the runtime, see <see cref="FormatAscii"/>), so the interval is symmetric.
    /// </summary>
    private static (long Digits, int Exponent) Shortest(int q, long c)
    {
        var odd = (int)c & 1;
        var cb = c << 2;
        var cbr = cb + 2;
        var cbl = cb - 2;
        var k = FloorLog10Pow2(q);
        var h = q + FloorLog2Pow10(-k) + 2;
        ref var g = ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(G), 2 * (k - KMin));
        var g1 = g;
        var g0 = Unsafe.Add(ref g, 1);
        var vb = RoundToOdd(g1, g0, cb << h);
        var vbl = RoundToOdd(g1, g0, cbl << h);
        var vbr = RoundToOdd(g1, g0, cbr << h);
        var s = vb >> 2;
        // The candidates: one digit fewer than s (when exactly one multiple of ten lies in the interval), else s or
        // s + 1 (the one in the interval, or the closer when both are, ties to even). All are computed and the
        // choice made with arithmetic, not branches: on measured data the shorter form fits about half the time, at
        // random, and a mispredicted branch costs a quarter of the whole conversion. (s ≥ 4.5·10¹⁵ here, so it
        // always has a digit to drop.)
        var sp10 = 10 * (s / 10);
        var tp10 = sp10 + 10;
        var upin = vbl + odd <= sp10 << 2;
        var wpin = (tp10 << 2) + odd <= vbr;
        var tt = s + 1;
        var uin = vbl + odd <= s << 2;
        var win = (tt << 2) + odd <= vbr;
        var cmp = vb - ((s + tt) << 1);
        var pickS = (uin & !win) | ((uin == win) & ((cmp < 0) | ((cmp == 0) & ((s & 1) == 0))));
        var longer = tt - One(pickS);
        var shorter = tp10 - (10 * One(upin));
        var useShorter = -One(upin != wpin);
        return (longer + ((shorter - longer) & useShorter), k);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static long One(bool b) => b ? 1 : 0;

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

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static int FloorLog10Pow2(int e) => (int)((e * 661_971_961_083L) >> 41);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static int FloorLog2Pow10(int e) => (e * 1_741_647) >> 19;

    private static int Zero(bool negative, Span<byte> destination)
    {
        if (negative)
        {
            destination[0] = (byte)'-';
            destination[1] = (byte)'0';
            return 2;
        }
        destination[0] = (byte)'0';
        return 1;
    }

    /// <summary>
    /// The runtime's general layout of a number 0.d₁…d₁₇ × 10^point (<paramref name="scaled"/> = d₁…d₁₇, 10¹⁶ ≤ scaled
    /// &lt; 10¹⁷, zeros after the last significant digit), into a destination of <see cref="AsciiRoom"/> bytes. The
    /// digits become text in three words that stay in registers: digits 1–8, 9–16 and 17. The decimal point is
    /// shifted into them, and they are stored whole; a word may carry bytes past the number, which the next number
    /// (or the caller) overwrites. (Text put into a scratch buffer and read back at an unaligned offset cost more than
    /// finding the digits: the loads waited for the stores.)
    /// </summary>
    private static int Layout(bool negative, ulong scaled, int point, Span<byte> destination)
    {
        var first8 = scaled / 1_000_000_000;
        var last9 = scaled - (first8 * 1_000_000_000);
        var next8 = last9 / 10;
        var x0 = EightDigits((uint)first8);
        var x1 = EightDigits((uint)next8);
        var x2 = (last9 - (next8 * 10)) | '0';
        // Significant digits: up to the last that is not '0' (the first digit never is). The trailing '0's are the
        // zero bytes at the top of each word xor '0'…'0' (lzcnt / 8, which is 8 for a word of zeros), counted
        // without a branch: whether the last digit has 16 or 17 significant digits is a coin toss on measured data,
        // and a mispredicted branch costs about as much as the rest of the layout.
        var lastIsZero = (int)(((x2 ^ '0') - 1) >> 63);
        var zeros1 = BitOperations.LeadingZeroCount(x1 ^ Zeros) >> 3;
        var zeros0 = BitOperations.LeadingZeroCount(x0 ^ Zeros) >> 3;
        var n = 17 - (lastIsZero * (1 + zeros1 + ((zeros1 >> 3) * zeros0)));
        ref var o = ref MemoryMarshal.GetReference(destination);
        var pos = 0;
        if (negative)
        {
            o = (byte)'-';
            pos = 1;
        }
        if (point > 17 || point < -3)
        {
            if (n == 1)
            {
                Unsafe.Add(ref o, pos++) = (byte)x0;
            }
            else
            {
                StoreWithPoint(x0, x1, x2, 1, ref Unsafe.Add(ref o, pos));
                pos += n + 1;
            }
            Unsafe.Add(ref o, pos++) = (byte)'E';
            var e = point - 1;
            Unsafe.Add(ref o, pos++) = e < 0 ? (byte)'-' : (byte)'+';
            e = Math.Abs(e);
            if (e >= 100)
            {
                Unsafe.Add(ref o, pos++) = (byte)('0' + (e / 100));
                e %= 100;
            }
            Unsafe.Add(ref o, pos++) = (byte)('0' + (e / 10));
            Unsafe.Add(ref o, pos++) = (byte)('0' + (e % 10));
            return pos;
        }
        if (point <= 0)
        {
            // "0." and up to three zeros, then the digits.
            Unsafe.WriteUnaligned(ref Unsafe.Add(ref o, pos), 0x0030_3030_3030_2E30UL);
            pos += 2 - point;
            Store(x0, x1, x2, ref Unsafe.Add(ref o, pos));
            return pos + n;
        }
        if (point >= n)
        {
            // An integer: the scaled digits already end in the zeros up to the point (at most 17 characters).
            Store(x0, x1, x2, ref Unsafe.Add(ref o, pos));
            return pos + point;
        }
        StoreWithPoint(x0, x1, x2, point, ref Unsafe.Add(ref o, pos));
        return pos + n + 1;
    }

    private const ulong Zeros = 0x3030_3030_3030_3030UL;

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Store(ulong x0, ulong x1, ulong x2, ref byte to)
    {
        Unsafe.WriteUnaligned(ref to, x0);
        Unsafe.WriteUnaligned(ref Unsafe.Add(ref to, 8), x1);
        Unsafe.WriteUnaligned(ref Unsafe.Add(ref to, 16), x2);
    }

    /// <summary>
    /// Stores the 17 digits with '.' after the first <paramref name="point"/> of them (1 ≤ point ≤ 16): the word
    /// that holds the place keeps its bytes below it, gets the point, and its bytes from there move up by one, as do
    /// the words after it.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void StoreWithPoint(ulong x0, ulong x1, ulong x2, int point, ref byte to)
    {
        const ulong dot = '.';
        ulong y0, y1, y2;
        if (point < 8)
        {
            var below = (1UL << (8 * point)) - 1;
            y0 = (x0 & below) | (dot << (8 * point)) | ((x0 & ~below) << 8);
            y1 = (x0 >> 56) | (x1 << 8);
            y2 = (x1 >> 56) | (x2 << 8);
        }
        else if (point < 16)
        {
            var below = (1UL << (8 * (point - 8))) - 1;
            y0 = x0;
            y1 = (x1 & below) | (dot << (8 * (point - 8))) | ((x1 & ~below) << 8);
            y2 = (x1 >> 56) | (x2 << 8);
        }
        else
        {
            y0 = x0;
            y1 = x1;
            y2 = dot | (x2 << 8);
        }
        Store(y0, y1, y2, ref to);
    }

    /// <summary>10⁰ … 10¹⁹.</summary>
    private static ReadOnlySpan<ulong> PowersOfTen =>
    [
        1UL, 10UL, 100UL, 1_000UL, 10_000UL, 100_000UL, 1_000_000UL, 10_000_000UL, 100_000_000UL, 1_000_000_000UL,
        10_000_000_000UL, 100_000_000_000UL, 1_000_000_000_000UL, 10_000_000_000_000UL, 100_000_000_000_000UL,
        1_000_000_000_000_000UL, 10_000_000_000_000_000UL, 100_000_000_000_000_000UL, 1_000_000_000_000_000_000UL,
        10_000_000_000_000_000_000UL,
    ];

    /// <summary>The number of decimal digits of <paramref name="v"/> (≥ 1): ⌊log10 v⌋ + 1 from the bit length.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static int DigitCount(ulong v)
    {
        // (bit length · 1233) >> 12 is ⌊log10 2^bits⌋ or one more; one comparison with a power of ten settles it.
        var r = ((64 - BitOperations.LeadingZeroCount(v | 1)) * 1233) >> 12;
        return r + 1 - (v < PowersOfTen[r] ? 1 : 0);
    }

    /// <summary>
    /// The eight ASCII digits of <paramref name="v"/> (&lt; 10⁸, leading zeros included) in one little-endian word,
    /// first digit in the lowest byte: the halves, quarters and single digits are split in parallel lanes of the
    /// word (each lane's quotient by a multiply and shift, exact in the lane's range), with no table.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static ulong EightDigits(uint v)
    {
        // Two 4-digit lanes of 32 bits: the first four digits in the low lane.
        ulong high = v / 10_000;
        ulong merged = high | ((v - (high * 10_000)) << 32);
        // x / 100 = (x · 10486) >> 20 for x < 10⁴ (exact below 43 699); four 2-digit lanes of 16 bits.
        var hundreds = ((merged * 10_486) >> 20) & 0x0000_007F_0000_007FUL;
        var pairs = ((merged - (hundreds * 100)) << 16) | hundreds;
        // y / 10 = (y · 103) >> 10 for y < 100 (exact below 179); eight 1-digit lanes of 8 bits.
        var tens = ((pairs * 103) >> 10) & 0x000F_000F_000F_000FUL;
        var digits = ((pairs - (tens * 10)) << 8) | tens;
        return digits | Zeros;
    }
}
