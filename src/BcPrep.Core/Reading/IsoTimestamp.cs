using System.Globalization;
using System.Text;

namespace BcPrep.Reading;

/// <summary>
/// Parses ISO-8601 timestamps from UTF-8 bytes to seconds since 1970-01-01 UTC. The common logger layout
/// (yyyy-MM-ddTHH:mm:ss[.fraction][Z|±hh:mm], 'T' or a space between date and time) is read straight from the
/// bytes, because going through a string per row costs more than parsing all the numbers of the row; anything
/// else falls back to the framework parser. A time without a zone is taken as UTC.
/// </summary>
public static class IsoTimestamp
{
    public static bool TryParseSeconds(ReadOnlySpan<byte> utf8, out double secondsSinceEpoch)
    {
        if (TryFast(utf8.Trim((byte)' '), out var ticks) || TryFallback(utf8, out ticks))
        {
            secondsSinceEpoch = ToSeconds(ticks);
            return true;
        }
        secondsSinceEpoch = double.NaN;
        return false;
    }

    /// <summary>
    /// Parses the timestamps of one log in row order. Consecutive rows share their date, hour and minute for a
    /// minute's worth of rows, so a row whose first 16 bytes (yyyy-MM-ddTHH:mm) repeat the previous row's only has
    /// its seconds, fraction and zone read. Same results as <see cref="TryParseSeconds"/>.
    /// </summary>
    public sealed class InOrder
    {
        private const int PrefixLength = 16;
        private readonly byte[] _prefix = new byte[PrefixLength];
        private long _minuteTicks = -1;

        public bool TryParseSeconds(ReadOnlySpan<byte> utf8, out double secondsSinceEpoch)
        {
            var s = utf8.Trim((byte)' ');
            if (_minuteTicks >= 0 && s.Length >= 19 && s[..PrefixLength].SequenceEqual(_prefix) && TryWithinMinute(s, out var withinMinute))
            {
                secondsSinceEpoch = ToSeconds(_minuteTicks + withinMinute);
                return true;
            }
            if (TryMinute(s, out var minuteTicks) && TryWithinMinute(s, out withinMinute))
            {
                s[..PrefixLength].CopyTo(_prefix);
                _minuteTicks = minuteTicks;
                secondsSinceEpoch = ToSeconds(minuteTicks + withinMinute);
                return true;
            }
            return IsoTimestamp.TryParseSeconds(utf8, out secondsSinceEpoch);
        }
    }

    private static double ToSeconds(long utcTicks) => (utcTicks - DateTimeOffset.UnixEpoch.UtcTicks) / (double)TimeSpan.TicksPerSecond;

    private static bool TryFast(ReadOnlySpan<byte> s, out long utcTicks)
    {
        utcTicks = 0;
        if (!TryMinute(s, out var minuteTicks) || !TryWithinMinute(s, out var withinMinute))
        {
            return false;
        }
        utcTicks = minuteTicks + withinMinute;
        return true;
    }

    /// <summary>yyyy-MM-ddTHH:mm (the first 16 bytes) as ticks of that minute.</summary>
    private static bool TryMinute(ReadOnlySpan<byte> s, out long minuteTicks)
    {
        minuteTicks = 0;
        if (s.Length < 19 || s[4] != '-' || s[7] != '-' || (s[10] != 'T' && s[10] != ' ') || s[13] != ':' || s[16] != ':')
        {
            return false;
        }
        if (!Digits(s[..4], out var year) || !Digits(s.Slice(5, 2), out var month) || !Digits(s.Slice(8, 2), out var day) ||
            !Digits(s.Slice(11, 2), out var hour) || !Digits(s.Slice(14, 2), out var minute))
        {
            return false;
        }
        if (month is < 1 or > 12 || day < 1 || day > DateTime.DaysInMonth(Math.Max(1, year), month) || hour > 23 || minute > 59)
        {
            return false;
        }
        minuteTicks = new DateTime(year, month, day, hour, minute, 0, DateTimeKind.Utc).Ticks;
        return true;
    }

    /// <summary>:ss[.fraction][Z|±hh:mm] (from byte 16 on) as ticks into the minute, less the zone offset.</summary>
    private static bool TryWithinMinute(ReadOnlySpan<byte> s, out long ticks)
    {
        ticks = 0;
        if (s.Length < 19 || s[16] != ':' || !Digits(s.Slice(17, 2), out var second) || second > 59)
        {
            return false;
        }
        var rest = s[19..];
        long fraction = 0;
        if (rest.Length > 0 && rest[0] == '.')
        {
            var i = 1;
            long scale = TimeSpan.TicksPerSecond;
            while (i < rest.Length && rest[i] >= '0' && rest[i] <= '9')
            {
                scale /= 10;
                fraction += (rest[i] - '0') * scale;
                i++;
            }
            if (i == 1)
            {
                return false;
            }
            rest = rest[i..];
        }
        long offset = 0;
        if (rest.Length == 1 && rest[0] == 'Z')
        {
            rest = [];
        }
        else if (rest.Length is 6 or 5 && (rest[0] == '+' || rest[0] == '-'))
        {
            var minutesAt = rest.Length == 6 ? 4 : 3;
            if ((rest.Length == 6 && rest[3] != ':') || !Digits(rest.Slice(1, 2), out var oh) || !Digits(rest.Slice(minutesAt, 2), out var om))
            {
                return false;
            }
            offset = ((oh * 60L) + om) * TimeSpan.TicksPerMinute * (rest[0] == '-' ? -1 : 1);
            rest = [];
        }
        if (rest.Length != 0)
        {
            return false;
        }
        ticks = (second * TimeSpan.TicksPerSecond) + fraction - offset;
        return true;
    }

    private static bool TryFallback(ReadOnlySpan<byte> utf8, out long utcTicks)
    {
        var ok = DateTimeOffset.TryParse(Encoding.UTF8.GetString(utf8), CultureInfo.InvariantCulture,
            DateTimeStyles.AssumeUniversal | DateTimeStyles.AllowWhiteSpaces, out var when);
        utcTicks = ok ? when.UtcTicks : 0;
        return ok;
    }

    private static bool Digits(ReadOnlySpan<byte> s, out int value)
    {
        value = 0;
        foreach (var b in s)
        {
            if (b < '0' || b > '9')
            {
                return false;
            }
            value = (value * 10) + (b - '0');
        }
        return true;
    }
}
