using System.IO.Compression;
using System.Text;
using System.Text.Json;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>
/// The same day written differently (gzip, semicolon with decimal comma, BOM with CRLF, standard input) gives the
/// same summary.csv; two loggers at different rates give each channel its statistics at its native rate.
/// </summary>
public sealed class InputVariantTests : IClassFixture<InputVariantTests.PlainDay>
{
    private readonly PlainDay _plain;

    public InputVariantTests(PlainDay plain) => _plain = plain;

    [Fact]
    public void Gzipped_logs_give_the_same_summary()
    {
        using var temp = new TempFolder();
        var logs = SampleDay.Logs.Select(log =>
        {
            var path = temp.File(Path.GetFileName(log) + ".gz");
            using var target = new GZipStream(File.Create(path), CompressionLevel.Fastest);
            target.Write(File.ReadAllBytes(log));
            return path;
        }).ToList();

        AssertSameSummary(Process(temp, SampleDay.Rig, logs));
    }

    [Fact]
    public void Semicolon_separated_logs_with_decimal_comma_give_the_same_summary()
    {
        using var temp = new TempFolder();
        var rig = temp.File("rig.toml");
        File.WriteAllText(rig, File.ReadAllText(SampleDay.Rig)
            .Replace("separator = \",\"", "separator = \";\"", StringComparison.Ordinal)
            .Replace("decimal = \".\"", "decimal = \",\"", StringComparison.Ordinal));
        var logs = SampleDay.Logs.Select(log =>
        {
            var path = temp.File(Path.GetFileName(log));
            File.WriteAllText(path, File.ReadAllText(log).Replace(',', ';').Replace('.', ','));
            return path;
        }).ToList();
        Assert.StartsWith("2026-11-24T09:00:00,000;3,10915;", File.ReadAllLines(logs[0])[1], StringComparison.Ordinal);

        AssertSameSummary(Process(temp, rig, logs));
    }

    [Fact]
    public void Logs_with_byte_order_mark_and_crlf_line_ends_give_the_same_summary()
    {
        using var temp = new TempFolder();
        var logs = SampleDay.Logs.Select(log =>
        {
            var path = temp.File(Path.GetFileName(log));
            File.WriteAllBytes(path, [0xEF, 0xBB, 0xBF, .. Encoding.UTF8.GetBytes(File.ReadAllText(log).Replace("\n", "\r\n", StringComparison.Ordinal))]);
            return path;
        }).ToList();

        AssertSameSummary(Process(temp, SampleDay.Rig, logs));
    }

    [Fact]
    public void Morning_log_from_standard_input_gives_the_same_summary()
    {
        using var temp = new TempFolder();

        var run = CliRunner.Run(["process", SampleDay.Rig, "-", SampleDay.Afternoon, "--out", temp.File("out")], File.ReadAllBytes(SampleDay.Morning));

        Assert.Equal(0, run.ExitCode);
        AssertSameSummary(File.ReadAllText(Path.Combine(temp.File("out"), "summary.csv")));
        Assert.Contains("\"file\": \"(standard input)\"", File.ReadAllText(Path.Combine(temp.File("out"), "manifest.json")), StringComparison.Ordinal);
    }

    [Fact]
    public void Two_loggers_at_different_rates_and_clock_notations_give_each_channel_its_native_rate_statistics()
    {
        // Logger A: barometer, pressures and flow meter at the sample day's 2 Hz, timestamps in UTC without offset.
        // Logger B: the RTD, thermocouples and heater at 1 Hz, its clock set to local time and stamped with a +01:00
        // offset, so its times read an hour later than A's for the same instant. The same underlying signals processed
        // as one 2 Hz logger and as one 1 Hz logger give the references: each channel's window statistics must equal
        // those of the reference at its own rate (the windows include both ends: 1201 and 601 samples in 600 s).
        using var temp = new TempFolder();
        var rows = SampleDay.Logs.SelectMany(l => File.ReadAllLines(l).Skip(1)).ToList();
        var header = File.ReadAllLines(SampleDay.Morning)[0].Split(',');
        var aColumns = new[] { 0, 1, 2, 3, 4 };
        var bColumns = Enumerable.Range(5, header.Length - 5).ToArray();
        var evenRows = rows.Where((_, i) => i % 2 == 0).ToList();
        var loggerA = temp.File("logger-a.csv");
        var loggerB = temp.File("logger-b.csv");
        var slow = temp.File("slow.csv");
        File.WriteAllLines(loggerA, [Pick(header, aColumns), .. rows.Select(r => Pick(r.Split(','), aColumns))]);
        File.WriteAllLines(loggerB, ["timestamp," + Pick(header, bColumns), .. evenRows.Select(r => LocalTime(r.Split(',')[0]) + "," + Pick(r.Split(','), bColumns))]);
        File.WriteAllLines(slow, [string.Join(',', header), .. evenRows]);
        Assert.StartsWith("2026-11-24T10:00:00.000+01:00,109.3501,", File.ReadAllLines(loggerB)[1], StringComparison.Ordinal);

        var split = Manifest(temp, "split", loggerB, loggerA);
        var slowOnly = Manifest(temp, "slow", slow);

        Assert.NotNull(split);
        foreach (var point in new[] { 0, 1, 2 })
        {
            foreach (var channel in new[] { "p_baro", "p_in", "p_out", "mdot" })
            {
                Assert.Equal(Channel(_plain.Manifest, point, channel), Channel(split, point, channel));
            }
            foreach (var channel in new[] { "t_cj", "t_in", "t_out", "t_w1", "t_w2", "t_w3", "t_w4", "heater_v", "heater_i" })
            {
                Assert.Equal(Channel(slowOnly, point, channel), Channel(split, point, channel));
            }
            Assert.Equal(1201, SampleCount(split, point, "mdot"));
            Assert.Equal(601, SampleCount(split, point, "t_out"));
        }
    }

    private static string Pick(string[] cells, int[] columns) => string.Join(',', columns.Select(c => cells[c]));

    private static string LocalTime(string utc)
    {
        var time = DateTime.Parse(utc, System.Globalization.CultureInfo.InvariantCulture).AddHours(1);
        return time.ToString("yyyy-MM-dd'T'HH:mm:ss.fff", System.Globalization.CultureInfo.InvariantCulture) + "+01:00";
    }

    private static string Manifest(TempFolder temp, string name, params string[] logs)
    {
        var run = CliRunner.Run(["process", SampleDay.Rig, .. logs, "--out", temp.File(name)]);
        Assert.True(run.ExitCode == 0, run.Error);
        return File.ReadAllText(Path.Combine(temp.File(name), "manifest.json"));
    }

    private static string Channel(string manifest, int point, string id)
    {
        using var document = JsonDocument.Parse(manifest);
        return document.RootElement.GetProperty("points")[point].GetProperty("channels").EnumerateArray()
            .Single(c => c.GetProperty("id").GetString() == id).GetRawText();
    }

    private static int SampleCount(string manifest, int point, string id)
    {
        using var document = JsonDocument.Parse(Channel(manifest, point, id));
        return document.RootElement.GetProperty("samples").GetInt32();
    }

    private static string Process(TempFolder temp, string rig, IReadOnlyList<string> logs)
    {
        var run = CliRunner.Run(["process", rig, .. logs, "--out", temp.File("out")]);
        Assert.True(run.ExitCode == 0, run.Error);
        return File.ReadAllText(Path.Combine(temp.File("out"), "summary.csv"));
    }

    private void AssertSameSummary(string summary)
    {
        Assert.Equal(6, summary.Split('\n').Length);
        Assert.Equal(_plain.Summary, summary);
    }

    /// <summary>The plain sample day, processed once for the whole class.</summary>
    public sealed class PlainDay : IDisposable
    {
        private readonly TempFolder _folder = new();

        public PlainDay()
        {
            var run = CliRunner.Run(SampleDay.ProcessArgs(_folder.File("out")));
            Assert.Equal(0, run.ExitCode);
            Summary = File.ReadAllText(Path.Combine(_folder.File("out"), "summary.csv"));
            Manifest = File.ReadAllText(Path.Combine(_folder.File("out"), "manifest.json"));
        }

        public string Summary { get; }

        public string Manifest { get; }

        public void Dispose() => _folder.Dispose();
    }
}
