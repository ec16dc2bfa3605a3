using System.Runtime.CompilerServices;

namespace BcPrep.Reading;

/// <summary>
/// The exact fast path for the plain decimals a data logger writes ("-0.1091", "109.3507"): an optional minus, at
/// most <see cref="MaxDigits"/> digits and at most one decimal separator with digits on both sides, nothing else.
/// Such a number is m / 10^f with m &lt; 10^15 &lt; 2^53 and f ≤ 15 &lt; 23, so m and 10^f are both doubles exactly
/// and one IEEE division rounds the quotient correctly: the same double a correctly rounding parser returns (the
/// classic fast path of decimal-to-binary conversion, W. D. Clinger, "How to read floating point numbers
/// accurately", PLDI 1990). Anything else (exponents, a plus sign, spaces, more digits, blanks, NaN) is left to the
/// general parser. On the reading thread, which paces a whole run, the general parser's per-cell set-up (culture
/// look-up, style checks) cost more than the digits themselves.
/// </summary>
internal static class ShortDecimal
{
    /// <summary>Digits (leading zeros included) that keep the integer m below 10^15, within a double's 2^53.</summary>
    internal const int MaxDigits = 15;

    private static readonly double[] PowersOfTen =
    [
        1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15,
    ];

    /// <summary>
    /// The value of <paramref name="text"/> (UTF-8) when it has the plain form above, with
    /// <paramref name="decimalSeparator"/> as its separator; false (value 0) for any other text, which the caller
    /// then parses the general way.
    /// </summary>
    /// <remarks>Inlined into the reader's loop over a row's cells: a call per cell measured about 5 % of the reading methods' time.</remarks>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static bool TryParse(ReadOnlySpan<byte> text, byte decimalSeparator, out double value)
    {
        value = 0;
        var i = 0;
        var negative = false;
        if (text.Length > 0 && text[0] == (byte)'-')
        {
            negative = true;
            i = 1;
        }
        ulong mantissa = 0;
        var digits = 0;
        var integerDigits = -1; // digits before the separator, once it is seen
        for (; i < text.Length; i++)
        {
            var digit = (uint)(text[i] - (byte)'0');
            if (digit <= 9)
            {
                mantissa = (mantissa * 10) + digit;
                digits++;
            }
            else if (text[i] == decimalSeparator && integerDigits < 0)
            {
                integerDigits = digits;
            }
            else
            {
                return false;
            }
        }
        if (digits == 0 || digits > MaxDigits || integerDigits == 0 || integerDigits == digits)
        {
            return false;
        }
        var fractionDigits = integerDigits < 0 ? 0 : digits - integerDigits;
        var magnitude = (double)mantissa / PowersOfTen[fractionDigits];
        value = negative ? -magnitude : magnitude;
        return true;
    }
}
