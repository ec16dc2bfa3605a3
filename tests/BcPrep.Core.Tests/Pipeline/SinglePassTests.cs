using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

public class SinglePassTests
{
    private static List<LogInput> SampleDay() =>
        Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal).Select(LogInput.FromPath).ToList();

    // Reference: the two-pass reduction, which reads the detected windows again from the log. Gathering them from
    // the rows kept back during the only read must give the same points, bit for bit.
    [Fact]
    public void Detected_points_gathered_during_the_read_equal_those_read_in_a_second_pass()
    {
        var rig = SeekingSecondPassTests.DetectingRig();

        var single = DayProcessor.Process(rig, SampleDay(), new ProcessOptions());
        var twoPasses = DayProcessor.Process(rig, SampleDay(), new ProcessOptions { SinglePass = false });

        Assert.Equal(3, single.Points.Count);
        // The plateau detection ran during the read and every window came from the kept rows: none is read again.
        Assert.Equal(0, single.WindowsReadAgain);
        Assert.Equal(0, single.SecondPassSeeks);
        Assert.Equal(3, twoPasses.WindowsReadAgain);
        SameDayAssert.Points(twoPasses, single);
    }

    // Reference: the two-pass reduction again. Rows are kept in whole read blocks (8192 rows, 819 s at 10 Hz); with
    // no span asked beyond that, a window whose first block was dropped before it was final is read again.
    [Fact]
    public void Windows_the_kept_rows_no_longer_cover_are_read_again()
    {
        var rig = SeekingSecondPassTests.DetectingRig();
        var folder = Path.Combine(Path.GetTempPath(), "bcprep-kept-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        try
        {
            var day = new[] { LogInput.FromPath(SeekingSecondPassTests.TenHertz(SampleDay().Select(l => l.Path).ToList(), Path.Combine(folder, "day-10hz.csv"))) };

            var shortKept = DayProcessor.Process(rig, day, new ProcessOptions { KeptRowsS = 0.0 });
            var twoPasses = DayProcessor.Process(rig, day, new ProcessOptions { SinglePass = false });

            Assert.Equal(3, shortKept.Points.Count);
            Assert.InRange(shortKept.WindowsReadAgain, 1, 3);
            Assert.True(shortKept.SecondPassSeeks >= 1);
            SameDayAssert.Points(twoPasses, shortKept);
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    // With a low-pass configured the block means come through the conditioning, a chunk behind the rows: the
    // detector runs late, the rows are kept that much longer, and the points are still those of two passes.
    [Fact]
    public void Detection_behind_a_conditioning_chunk_still_gathers_every_point()
    {
        var rig = SeekingSecondPassTests.DetectingRig("\n[conditioning]\nlowpass_cutoff = \"0.2 Hz\"\n");

        var single = DayProcessor.Process(rig, SampleDay(), new ProcessOptions());
        var twoPasses = DayProcessor.Process(rig, SampleDay(), new ProcessOptions { SinglePass = false });

        Assert.Equal(3, single.Points.Count);
        Assert.Equal(0, single.WindowsReadAgain);
        SameDayAssert.Points(twoPasses, single);
    }

    // The pinned copy of the sample rig pins its three points, which replace the detected windows they overlap: nothing is gathered
    // ahead, nothing is read again, and the results are those of the two-pass path.
    [Fact]
    public void Pinned_points_are_unaffected()
    {
        var rig = RigLoader.Load(File.ReadAllText(Tests.Rig.RigLoaderTests.PinnedSampleRigPath), Tests.Rig.RigLoaderTests.PinnedSampleRigPath);

        var single = DayProcessor.Process(rig, SampleDay(), new ProcessOptions());
        var twoPasses = DayProcessor.Process(rig, SampleDay(), new ProcessOptions { SinglePass = false });

        Assert.All(single.Points, p => Assert.Equal(WindowOrigin.RigFile, p.Origin));
        Assert.Equal(0, single.WindowsReadAgain);
        SameDayAssert.Points(twoPasses, single);
    }

    // Reference: the same single read with the rows kept in memory. Kept in temporary files instead, and loaded one
    // channel at a time when each channel's statistics start, the rows must give the same points, bit for bit; the
    // folder is left empty, and no more channels are loaded at once than there are statistics threads.
    [Fact]
    public void Rows_kept_in_temporary_files_give_the_points_of_rows_kept_in_memory()
    {
        var rig = SeekingSecondPassTests.DetectingRig();
        var folder = Path.Combine(Path.GetTempPath(), "bcprep-kept-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        try
        {
            var inMemory = DayProcessor.Process(rig, SampleDay(), new ProcessOptions());
            var onDisk = DayProcessor.Process(rig, SampleDay(), new ProcessOptions { KeptRowsFolder = folder });

            Assert.Equal(3, onDisk.Points.Count);
            Assert.Equal(0, onDisk.WindowsReadAgain);
            SameDayAssert.Points(inMemory, onDisk);
            Assert.Empty(Directory.EnumerateFileSystemEntries(folder));
            // Gathering a whole window at once would load every channel of it (more than there are threads here).
            var channels = onDisk.Points[0].Channels.Count;
            Assert.True(channels > StatisticsWorkers.Threads, $"{channels} channels cannot tell one at a time from all at once on {StatisticsWorkers.Threads} threads");
            Assert.InRange(onDisk.PeakWindowChannelsLoaded, 1, StatisticsWorkers.Threads);
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    // The same with the detection a conditioning chunk behind the rows (a low-pass): the rows are kept longer, and
    // the points are still those of rows kept in memory.
    [Fact]
    public void Rows_kept_in_temporary_files_behind_a_conditioning_chunk_give_the_same_points()
    {
        var rig = SeekingSecondPassTests.DetectingRig("\n[conditioning]\nlowpass_cutoff = \"0.2 Hz\"\n");
        var folder = Path.Combine(Path.GetTempPath(), "bcprep-kept-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        try
        {
            var inMemory = DayProcessor.Process(rig, SampleDay(), new ProcessOptions());
            var onDisk = DayProcessor.Process(rig, SampleDay(), new ProcessOptions { KeptRowsFolder = folder });

            Assert.Equal(0, onDisk.WindowsReadAgain);
            SameDayAssert.Points(inMemory, onDisk);
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    // A folder for the kept rows that does not exist fails the run before the read, as an output failure naming it.
    [Fact]
    public void A_missing_folder_for_the_kept_rows_is_an_output_failure()
    {
        var missing = Path.Combine(Path.GetTempPath(), "bcprep-missing-" + Guid.NewGuid().ToString("N"));

        var failure = Assert.Throws<BcPrepFailure>(() => DayProcessor.Process(SeekingSecondPassTests.DetectingRig(), SampleDay(), new ProcessOptions { KeptRowsFolder = missing }));

        Assert.Equal(FailureKind.Output, failure.Kind);
        Assert.Equal(missing, failure.Problems[0].Location.File);
    }
}
