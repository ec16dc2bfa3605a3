using System.IO.Compression;
using System.Text.RegularExpressions;
using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

public class SeekingSecondPassTests
{
    [Fact]
    public void Seeking_to_the_detected_windows_gives_the_same_statistics_as_reading_the_whole_day_again()
    {
        // Gzipped logs cannot seek, so they take the full second pass: the reference for the seeking one.
        var rig = DetectingRig();
        var plain = Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal).ToList();
        var folder = Path.Combine(Path.GetTempPath(), "bcprep-seek-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        try
        {
            plain = [TenHertz(plain, Path.Combine(folder, "day-10hz.csv"))];
            var zipped = plain.Select(p =>
            {
                var target = Path.Combine(folder, Path.GetFileName(p) + ".gz");
                using var output = new GZipStream(File.Create(target), CompressionLevel.Fastest);
                using var input = File.OpenRead(p);
                input.CopyTo(output);
                return target;
            }).ToList();

            // Gathering the windows during the first read would leave nothing to read again.
            var twoPasses = new ProcessOptions { SinglePass = false };
            var seeking = DayProcessor.Process(rig, plain.Select(LogInput.FromPath).ToList(), twoPasses);
            var full = DayProcessor.Process(rig, zipped.Select(LogInput.FromPath).ToList(), twoPasses);

            // 99 000 rows in 12 blocks of 8192: the windows start in blocks 4, 7 and 11, so the second pass seeks.
            Assert.Equal(3, seeking.Points.Count);
            Assert.All(seeking.Points, p => Assert.Equal(WindowOrigin.Detected, p.Origin));
            Assert.True(seeking.SecondPassSeeks >= 2, $"{seeking.SecondPassSeeks} seeks");
            Assert.Equal(0, full.SecondPassSeeks);
            for (var i = 0; i < seeking.Points.Count; i++)
            {
                foreach (var (channel, stats) in seeking.Points[i].Channels)
                {
                    var reference = full.Points[i].Channels[channel];
                    Assert.Equal(reference.SampleCount, stats.SampleCount);
                    Assert.Equal(reference.Mean, stats.Mean);
                    Assert.Equal(reference.TypeA.StandardUncertainty, stats.TypeA.StandardUncertainty);
                }
            }
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    /// <summary>The sample rig without its pinned points, so that every operating point is detected.</summary>
    internal static RigDescription DetectingRig(string appended = "")
    {
        var text = Regex.Replace(File.ReadAllText(Tests.Rig.RigLoaderTests.SampleRigPath), @"\[\[point\]\]\s*\nid = ""[^""]*""\s*\nstart = ""[^""]*""\s*\nend = ""[^""]*""\s*\n", "");
        return RigLoader.Load(text + appended, "detect.toml");
    }

    /// <summary>The sample day in one file at 10 Hz: every 2 Hz row repeated at 0.1 s steps.</summary>
    internal static string TenHertz(IReadOnlyList<string> logs, string path)
    {
        var lines = new List<string> { File.ReadLines(logs[0]).First() };
        foreach (var log in logs)
        {
            foreach (var line in File.ReadLines(log).Skip(1))
            {
                var comma = line.IndexOf(',', StringComparison.Ordinal);
                var time = DateTime.Parse(line[..comma], System.Globalization.CultureInfo.InvariantCulture);
                for (var k = 0; k < 5; k++)
                {
                    lines.Add(time.AddMilliseconds(100 * k).ToString("yyyy-MM-dd'T'HH:mm:ss.fff", System.Globalization.CultureInfo.InvariantCulture) + line[comma..]);
                }
            }
        }
        File.WriteAllLines(path, lines);
        return path;
    }
}
