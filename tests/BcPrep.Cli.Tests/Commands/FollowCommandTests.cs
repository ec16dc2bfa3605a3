using System.Text;
using System.Text.Json;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli.Commands;

/// <summary>
/// <c>bcprep follow</c> against a logger still writing: the sample day's two files are written into a folder row by
/// row, in pieces (a row may be cut anywhere and its rest written later), the second file started when the first is
/// done, while the command follows the folder. At the end the output folder must equal what <c>process</c> writes on
/// the same two files, byte for byte.
/// </summary>
public class FollowCommandTests
{
    [Fact]
    public void Following_a_day_as_it_is_written_ends_with_the_folder_process_writes()
    {
        using var temp = new TempFolder();
        var logs = Directory.CreateDirectory(temp.File("logger")).FullName;
        var followed = temp.File("followed");
        var processed = temp.File("processed");
        var writer = new Thread(() => Replay(logs));
        writer.Start();
        var follow = CliRunner.Run("follow", SampleDay.Rig, logs, "--out", followed, "--interval", "0.2", "--end-after-idle", "3", "--json");
        writer.Join();

        Assert.True(follow.ExitCode == 0, follow.Error);
        var files = SampleDay.Logs.Select(l => Path.Combine(logs, Path.GetFileName(l))).ToArray();
        var process = CliRunner.Run(["process", SampleDay.Rig, .. files, "--out", processed]);
        Assert.Equal(0, process.ExitCode);
        var expected = SampleDay.Snapshot(processed);
        var actual = SampleDay.Snapshot(followed);
        Assert.Equal(expected.Keys, actual.Keys);
        foreach (var (name, bytes) in expected)
        {
            Assert.True(bytes.AsSpan().SequenceEqual(actual[name]), $"{name} differs from what process wrote");
        }

        // Every report is one JSON object on its own line, with one entry per [steady] key channel of the rig file.
        var reports = follow.Out.Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(l => JsonDocument.Parse(l).RootElement).ToList();
        Assert.NotEmpty(reports);
        var last = reports.Last(r => r.GetProperty("event").GetString() == "report");
        Assert.Equal(["mdot", "t_out", "t_w3"], last.GetProperty("channels").EnumerateArray().Select(c => c.GetProperty("channel").GetString()));
        // The sample day lasts 2 h 45 min at 2 Hz; the last report is at its last row (s since the first).
        Assert.InRange(last.GetProperty("time_s").GetDouble(), 9800, 9920);
    }

    [Fact]
    public void The_options_that_change_the_reduction_mean_what_they_mean_for_process()
    {
        // A day already logged: every point finishes in the first poll (reduced on the way with the matrix), and the
        // end leaves what `process --matrix` writes: the planned point names (sample-logs/plans/marten-matrix.csv).
        using var temp = new TempFolder();
        var logs = Directory.CreateDirectory(temp.File("logger")).FullName;
        foreach (var log in SampleDay.Logs)
        {
            File.Copy(log, Path.Combine(logs, Path.GetFileName(log)));
        }
        var matrix = Path.Combine(RepoRoot.Path, "sample-logs", "plans", "marten-matrix.csv");
        var follow = CliRunner.Run("follow", SampleDay.Rig, logs, "--out", temp.File("followed"), "--end-after-idle", "0", "--matrix", matrix, "--allow-expired", "all");
        var files = SampleDay.Logs.Select(l => Path.Combine(logs, Path.GetFileName(l))).ToArray();
        var process = CliRunner.Run(["process", SampleDay.Rig, .. files, "--out", temp.File("processed"), "--matrix", matrix, "--allow-expired", "all"]);

        Assert.True(follow.ExitCode == 0, follow.Error);
        Assert.Equal(0, process.ExitCode);
        Assert.Contains("the day so far (3 point(s)) is reduced", follow.Error, StringComparison.Ordinal);
        var expected = SampleDay.Snapshot(temp.File("processed"));
        var actual = SampleDay.Snapshot(temp.File("followed"));
        Assert.Equal(expected.Keys, actual.Keys);
        Assert.Contains(expected.Keys, k => k.StartsWith("points/F20-H600/", StringComparison.Ordinal));
        foreach (var (name, bytes) in expected)
        {
            Assert.True(bytes.AsSpan().SequenceEqual(actual[name]), $"{name} differs from what process wrote");
        }
    }

    [Fact]
    public void Follow_offers_every_option_of_process_that_changes_the_reduction()
    {
        var help = CliRunner.Run("follow", "--help");
        foreach (var option in new[] { "--allow-expired", "--matrix", "--monte-carlo", "--seed", "--report" })
        {
            Assert.Contains(option, help.Out + help.Error, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void A_missing_log_folder_is_a_usage_error_naming_it()
    {
        using var temp = new TempFolder();
        var run = CliRunner.Run("follow", SampleDay.Rig, temp.File("nowhere"), "--out", temp.File("out"), "--end-after-idle", "0");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("nowhere", run.Error, StringComparison.Ordinal);
        Assert.Empty(run.Out);
        Assert.False(Directory.Exists(temp.File("out")));
    }

    /// <summary>Writes the sample day's files into <paramref name="folder"/> like a logger, as fast as the pieces allow.</summary>
    private static void Replay(string folder)
    {
        var random = new Random(11);
        foreach (var source in SampleDay.Logs)
        {
            using var log = new FileStream(Path.Combine(folder, Path.GetFileName(source)), FileMode.CreateNew, FileAccess.Write, FileShare.Read);
            var lines = File.ReadAllLines(source);
            for (var i = 0; i < lines.Length; i++)
            {
                var bytes = Encoding.UTF8.GetBytes(lines[i] + "\n");
                var cut = random.Next(50) == 0 ? random.Next(1, bytes.Length) : bytes.Length;
                log.Write(bytes, 0, cut);
                log.Flush();
                if (cut < bytes.Length)
                {
                    Thread.Sleep(1);
                    log.Write(bytes, cut, bytes.Length - cut);
                }
                if (i % 400 == 0)
                {
                    log.Flush();
                    Thread.Sleep(2);
                }
            }
        }
    }
}
