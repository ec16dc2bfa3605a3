using System.Text;
using BcPrep.Live;
using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;
using BcPrep.Tests.Pipeline;

namespace BcPrep.Tests.Live;

/// <summary>
/// The day so far, scanned piece by piece as a logger writes it (<see cref="DaySoFar"/>), against the reference: the
/// whole reduction (<see cref="DayProcessor.Process"/>) run on the same rows in one go. The points must agree to the
/// bit, and a point reduced at an earlier piece (its window statistics kept) must equal the one-go result at the end.
/// </summary>
public class DaySoFarTests
{
    private static readonly string[] SampleFiles =
        [.. Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal)];

    /// <summary>Byte offsets just after each line end of a file, line 1 (the header) included.</summary>
    private static List<long> LineEnds(string path)
    {
        var bytes = File.ReadAllBytes(path);
        var ends = new List<long>();
        for (var i = 0; i < bytes.Length; i++)
        {
            if (bytes[i] == (byte)'\n')
            {
                ends.Add(i + 1);
            }
        }
        return ends;
    }

    /// <summary>Feeds the files in pieces of <paramref name="linesPerPiece"/> lines, as a follower would see them complete.</summary>
    private static void ReadInPieces(DaySoFar day, IReadOnlyList<string> files, int linesPerPiece, long? lastFileLines = null)
    {
        for (var f = 0; f < files.Count; f++)
        {
            var ends = LineEnds(files[f]);
            var count = f == files.Count - 1 && lastFileLines is { } n ? (int)n : ends.Count;
            for (var line = Math.Min(linesPerPiece, count); ; line = Math.Min(line + linesPerPiece, count))
            {
                day.ReadTo(files.Take(f + 1).ToList(), ends[line - 1]);
                if (line == count)
                {
                    break;
                }
            }
        }
    }

    [Fact]
    public void A_day_read_in_pieces_and_reduced_on_the_way_ends_as_the_whole_reduction()
    {
        // Pieces of 700 lines: never a whole read block (8192 rows), so the second read of a window crosses several
        // index entries of the pieces. The sample rig pins its three points; the detecting rig finds them.
        foreach (var rig in new[] { SampleRig(), SeekingSecondPassTests.DetectingRig() })
        {
            var day = new DaySoFar(rig, new ProcessOptions());
            ReadInPieces(day, [SampleFiles[0]], 700);
            // Mid-day: the first point is finished (its window's statistics are kept for later reductions).
            var midDay = day.Reduce();
            Assert.NotEmpty(midDay.Points);
            ReadInPieces(day, SampleFiles, 700);

            var reference = DayProcessor.Process(rig, SampleFiles.Select(LogInput.FromPath).ToList(), new ProcessOptions());
            var followed = day.Reduce();

            Assert.Equal(3, followed.Points.Count);
            SameDayAssert.Points(reference, followed);
        }
    }

    [Fact]
    public void The_day_so_far_is_what_the_whole_reduction_gives_on_the_rows_logged_so_far()
    {
        // Up to 6800 s: the morning file and 2000 s of the afternoon one (steps at 600, 3600, 6600 s in the generator,
        // tools/SampleDay/DayScenario.cs), so two points are finished and the third has only begun.
        var rig = SeekingSecondPassTests.DetectingRig();
        using var temp = new TempCopy(SampleFiles[1], 4001);
        var day = new DaySoFar(rig, new ProcessOptions());
        ReadInPieces(day, SampleFiles, 1000, lastFileLines: 4001);

        var reference = DayProcessor.Process(rig, [LogInput.FromPath(SampleFiles[0]), LogInput.FromPath(temp.Path)], new ProcessOptions());
        var followed = day.Reduce();

        Assert.Equal(2, followed.Points.Count);
        SameDayAssert.Points(reference, followed);
    }

    [Fact]
    public void A_pinned_point_not_yet_reached_is_left_out_of_the_day_so_far()
    {
        // The sample rig pins OP3 at 150–160 min (9000–9600 s); at 6800 s it is not reached, OP1 and OP2 are.
        var day = new DaySoFar(SampleRig(), new ProcessOptions());
        ReadInPieces(day, SampleFiles, 5000, lastFileLines: 4001);

        var followed = day.Reduce();

        Assert.Equal(["OP1", "OP2"], followed.Points.Select(p => p.Id));
    }

    [Fact]
    public void A_bad_cell_in_a_new_piece_names_its_file_line_and_column_and_every_later_call_fails_alike()
    {
        using var temp = new TempCopy(SampleFiles[0], 2001);
        var path = temp.Path;
        var lines = File.ReadAllLines(path);
        var cells = lines[1500].Split(',');
        cells[3] = "1.2.3";
        lines[1500] = string.Join(',', cells);
        File.WriteAllText(path, string.Join('\n', lines) + "\n", Encoding.UTF8);
        var ends = LineEnds(path);
        var day = new DaySoFar(SampleRig(), new ProcessOptions());
        day.ReadTo([path], ends[999]);

        var failure = Assert.Throws<BcPrepFailure>(() => day.ReadTo([path], ends[^1]));

        Assert.Equal(FailureKind.InputData, failure.Kind);
        var problem = Assert.Single(failure.Problems);
        Assert.Equal(1501, problem.Location.Line);
        Assert.Equal(4, problem.Location.Column);
        Assert.Throws<BcPrepFailure>(() => day.Reduce());
    }

    private static RigDescription SampleRig() => RigLoader.Load(File.ReadAllText(Tests.Rig.RigLoaderTests.SampleRigPath), Tests.Rig.RigLoaderTests.SampleRigPath);

    /// <summary>The first lines of a log in a temporary file of the same name.</summary>
    private sealed class TempCopy : IDisposable
    {
        private readonly string _folder = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "bcprep-sofar-" + Guid.NewGuid().ToString("N"));

        public TempCopy(string source, int lines)
        {
            Directory.CreateDirectory(_folder);
            Path = System.IO.Path.Combine(_folder, System.IO.Path.GetFileName(source));
            File.WriteAllLines(Path, File.ReadLines(source).Take(lines));
        }

        public string Path { get; }

        public void Dispose() => Directory.Delete(_folder, recursive: true);
    }
}
