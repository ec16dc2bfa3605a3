using System.Globalization;
using System.Text;
using BcPrep.Reading;

namespace BcPrep.Tests.Reading;

/// <summary>
/// The follower against a logger that is still writing: rows appear in pieces (a line is cut anywhere and its rest
/// written later), the logger starts a new file half-way, and the follower must report every row exactly once, in
/// order, and never a piece of one. Common practice: a logger writes a row with one or more unbuffered writes.
/// </summary>
public class LogFollowerTests
{
    private static string Row(int i) => string.Create(CultureInfo.InvariantCulture, $"{i * 0.1:R},{20 + Math.Sin(i * 0.01):R},{101325 + i % 17:R}");

    [Fact]
    public void A_backlog_larger_than_one_poll_is_taken_in_pieces_each_row_once()
    {
        // A follower started after the logger had written more than MaxPollBytes into its first file, and a second
        // file already begun: each poll takes at most MaxPollBytes, says whether more is there, and the rotation
        // waits until the first file is read to its end.
        using var temp = new TempFiles();
        var rows = (LogFileReaderRowsFor(LogFollower.MaxPollBytes) * 3) / 2;
        File.WriteAllText(Path.Combine(temp.Root, "day-001.csv"), "time,t_in,p_out\n" + string.Concat(Enumerable.Range(0, rows).Select(i => Row(i) + "\n")));
        File.WriteAllText(Path.Combine(temp.Root, "day-002.csv"), "time,t_in,p_out\n" + Row(rows) + "\n");
        var follower = new LogFollower(temp.Root, "*.csv");

        var first = follower.Poll();
        Assert.True(follower.HasMore);
        Assert.InRange(first.Sum(l => l.Text.Length + 1), LogFollower.MaxPollBytes - 200, LogFollower.MaxPollBytes);
        Assert.All(first, l => Assert.Equal("day-001.csv", l.FileName));
        var seen = new List<FollowedLine>(first);
        var polls = 1;
        while (follower.HasMore || polls == 1)
        {
            seen.AddRange(follower.Poll());
            polls++;
        }

        Assert.Equal(Enumerable.Range(0, rows + 1).Select(Row), seen.Where(l => !l.IsHeader).Select(l => l.Text));
        Assert.False(follower.HasMore);
    }

    /// <summary>About how many rows of <see cref="Row"/> fill <paramref name="bytes"/>.</summary>
    private static int LogFileReaderRowsFor(int bytes) => bytes / (Row(123456).Length + 1);

    [Fact]
    public void A_day_written_in_pieces_with_a_rotation_is_seen_row_by_row_exactly_once_in_order()
    {
        using var temp = new TempFiles();
        const int rows = 2000;
        const int rotateAt = 1100;
        // 10 Hz rows (0.1 s apart) replayed at 100× real time: one row a millisecond.
        var writer = new Thread(() => WriteDay(temp.Root, rows, rotateAt, TimeSpan.FromMilliseconds(1)));
        var follower = new LogFollower(temp.Root, "*.csv");
        var seen = new List<FollowedLine>();
        writer.Start();
        while (writer.IsAlive)
        {
            seen.AddRange(follower.Poll());
            Thread.Sleep(3);
        }
        seen.AddRange(follower.Poll());

        var data = seen.Where(l => !l.IsHeader).Select(l => l.Text).ToList();
        Assert.Equal(Enumerable.Range(0, rows).Select(Row), data);
        Assert.Equal(2, seen.Count(l => l.IsHeader));
        Assert.All(seen.Where(l => l.IsHeader), l => Assert.Equal("time,t_in,p_out", l.Text));
        Assert.Equal(["day-001.csv", "day-002.csv"], follower.Files.Select(Path.GetFileName));
        // Line numbers run on in each file (header = 1), so a message can point into the file the logger wrote.
        var second = seen.Where(l => l.FileName == "day-002.csv").ToList();
        Assert.Equal(Enumerable.Range(1, rows - rotateAt + 1).Select(i => (long)i), second.Select(l => l.LineNumber));
    }

    [Fact]
    public void A_partly_written_last_line_is_held_back_until_its_newline_arrives()
    {
        using var temp = new TempFiles();
        var path = Path.Combine(temp.Root, "day-001.csv");
        using var log = new FileStream(path, FileMode.CreateNew, FileAccess.Write, FileShare.Read);
        void Write(string text)
        {
            log.Write(Encoding.UTF8.GetBytes(text));
            log.Flush();
        }
        var follower = new LogFollower(temp.Root, "*.csv");
        Write("time,a\r\n0,1.5\r\n1,2.");
        Assert.Equal(["time,a", "0,1.5"], follower.Poll().Select(l => l.Text));
        Assert.Empty(follower.Poll());
        Write("25");
        Assert.Empty(follower.Poll());
        Write("\r\n2,3\n");
        var later = follower.Poll();
        Assert.Equal(["1,2.25", "2,3"], later.Select(l => l.Text));
        Assert.Equal([3L, 4L], later.Select(l => l.LineNumber));
    }

    [Fact]
    public void The_last_line_of_a_file_the_logger_left_without_a_newline_is_complete_once_a_newer_file_appears()
    {
        using var temp = new TempFiles();
        temp.Write("day-001.csv", "time,a\n0,1\n1,2");
        var follower = new LogFollower(temp.Root, "*.csv");
        Assert.Equal(["time,a", "0,1"], follower.Poll().Select(l => l.Text));
        temp.Write("day-002.csv", "time,a\n2,3\n");
        Assert.Equal(["1,2", "time,a", "2,3"], follower.Poll().Select(l => l.Text));
    }

    [Fact]
    public void A_followed_file_that_shrinks_is_refused_with_its_name()
    {
        using var temp = new TempFiles();
        var path = temp.Write("day-001.csv", "time,a\n0,1\n1,2\n");
        var follower = new LogFollower(temp.Root, "*.csv");
        follower.Poll();
        File.WriteAllText(path, "time,a\n");
        var failure = Assert.Throws<BcPrepFailure>(() => follower.Poll());
        Assert.Contains("day-001.csv", failure.Message);
        Assert.Contains("shrank", failure.Message);
    }

    /// <summary>
    /// Writes like a logger: the file is held open for writing (others may only read), each row goes out in one to
    /// three pieces with a flush after each so that a reader can catch the file between them, and at
    /// <paramref name="rotateAt"/> the file is closed and a new one begun with its own header.
    /// </summary>
    private static void WriteDay(string folder, int rows, int rotateAt, TimeSpan perRow)
    {
        var random = new Random(7);
        FileStream Open(string name)
        {
            var s = new FileStream(Path.Combine(folder, name), FileMode.CreateNew, FileAccess.Write, FileShare.Read);
            s.Write("time,t_in,p_out\n"u8);
            s.Flush();
            return s;
        }
        var log = Open("day-001.csv");
        try
        {
            for (var i = 0; i < rows; i++)
            {
                if (i == rotateAt)
                {
                    log.Dispose();
                    log = Open("day-002.csv");
                }
                var bytes = Encoding.UTF8.GetBytes(Row(i) + "\n");
                var cut = random.Next(3) == 0 ? random.Next(1, bytes.Length) : bytes.Length;
                log.Write(bytes, 0, cut);
                log.Flush();
                if (cut < bytes.Length)
                {
                    Thread.Sleep(perRow);
                    log.Write(bytes, cut, bytes.Length - cut);
                    log.Flush();
                }
                Thread.Sleep(perRow);
            }
        }
        finally
        {
            log.Dispose();
        }
    }
}
