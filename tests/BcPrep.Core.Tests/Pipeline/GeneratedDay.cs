using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// A small steady test day for end-to-end properties: the sample rig (sample-logs/marten-rig.toml) with times in
/// seconds and one pinned window, and a generated log at 1 Hz whose raw readings sit near the sample day's first
/// operating point with a little seeded noise. Small enough that one DayProcessor run takes a fraction of a second.
/// </summary>
internal sealed partial class GeneratedDay : IDisposable
{
    public static readonly string[] Columns =
        ["PBARO_V", "PT_IN_V", "PT_OUT_V", "FM_MA", "RTD_CJ_OHM", "TC_IN_MV", "TC_OUT_MV", "TC_W1_MV", "TC_W2_MV", "TC_W3_MV", "TC_W4_MV", "HTR_V_SIG", "HTR_I_SIG"];

    // Raw readings of the sample day at 09:47:00 (operating point 1), column by column.
    private static readonly double[] Level = [3.10370, 0.60799, 0.53387, 10.4190, 109.3229, -0.0952, 1.0453, 3.4693, 3.7418, 4.0102, 4.2787, 4.80085, 1.99911];

    public const double FirstTimeS = 1000.0;
    public const int Rows = 240;
    public const int FanOffRows = 20;

    private readonly string _folder = Directory.CreateTempSubdirectory("bcprep-day-property-").FullName;

    /// <summary>Raw values [row][column]; the first <see cref="FanOffRows"/> rows read zero flow pressure when asked.</summary>
    public double[][] Raw { get; }

    public double[] TimesS { get; }

    public GeneratedDay(int seed, bool fanOffStart = false)
    {
        var random = new Random(seed);
        TimesS = Enumerable.Range(0, Rows).Select(i => FirstTimeS + i).ToArray();
        Raw = Enumerable.Range(0, Rows).Select(i => Level.Select((level, c) =>
        {
            var noise = 2e-4 * (Math.Abs(level) + 0.1) * (random.NextDouble() - 0.5);
            var isGauge = Columns[c] is "PT_IN_V" or "PT_OUT_V";
            return (fanOffStart && isGauge && i < FanOffRows ? 0.0 : level) + noise;
        }).ToArray()).ToArray();
    }

    /// <summary>The sample rig in seconds, one window [start, end] s after the first sample, tares as asked.</summary>
    public static RigDescription Rig(double startS, double endS, string? tare = null)
    {
        var text = File.ReadAllText(Path.Combine(RepoRoot.Path, "tests", "marten-rig-pinned.toml"));
        text = text.Replace("time_format = \"iso8601\"", "time_format = \"seconds\"", StringComparison.Ordinal);
        text = TareLine().Replace(text, tare is null ? "" : $"tare = {{ {tare} }}\n");
        var points = text.IndexOf("\n[[point]]", StringComparison.Ordinal) + 1;
        var steady = text.IndexOf("\n[steady]", StringComparison.Ordinal) + 1;
        text = text[..points] + string.Create(CultureInfo.InvariantCulture, $"[[point]]\nid = \"OP1\"\nstart = \"{startS:R} s\"\nend = \"{endS:R} s\"\n\n") + text[steady..];
        return RigLoader.Load(text, "generated-rig.toml");
    }

    /// <summary>Writes rows [from, to) as one log file and returns it.</summary>
    public LogInput Write(string name, int from = 0, int to = Rows, Func<double, double>? time = null, Func<int, double, double>? raw = null)
    {
        var text = new StringBuilder("timestamp," + string.Join(',', Columns) + "\n");
        for (var i = from; i < to; i++)
        {
            text.Append((time?.Invoke(TimesS[i]) ?? TimesS[i]).ToString("R", CultureInfo.InvariantCulture));
            for (var c = 0; c < Columns.Length; c++)
            {
                text.Append(',').Append((raw?.Invoke(c, Raw[i][c]) ?? Raw[i][c]).ToString("R", CultureInfo.InvariantCulture));
            }
            text.Append('\n');
        }
        var path = Path.Combine(_folder, name);
        File.WriteAllText(path, text.ToString());
        return LogInput.FromPath(path);
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(_folder, recursive: true);
        }
        catch (IOException)
        {
        }
    }

    [GeneratedRegex(@"tare = \{[^}]*\}[^\n]*\n")]
    private static partial Regex TareLine();
}
