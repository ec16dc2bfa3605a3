using BcPrep.Pipeline;

namespace BcPrep.Tests.Pipeline;

public sealed class DiskRowBlocksTests : IDisposable
{
    private static readonly string[] Channels = ["a", "b", "c"];

    private readonly string _folder = Path.Combine(Path.GetTempPath(), "bcprep-rows-tests-" + Guid.NewGuid().ToString("N"));

    public DiskRowBlocksTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    /// <summary>
    /// Rows at uneven steps from <paramref name="firstS"/> (so a window's edges fall inside blocks); a reads the time,
    /// b a value that is not a simple function of it, c its negative.
    /// </summary>
    private static void AddBlock(RecentRows rows, double firstS, int count)
    {
        var times = Enumerable.Range(0, count).Select(i => firstS + i + (0.25 * Math.Sin(i))).ToArray();
        rows.Add(Channels, times, [times, times.Select(t => Math.Cos(t) * 1e5).ToArray(), times.Select(t => -t).ToArray()], count);
    }

    private static Dictionary<string, (double[] T, double[] V)> GatherAll(RecentRows rows, TimeWindow window)
    {
        var gathered = new Dictionary<string, (double[] T, double[] V)>();
        rows.Gather(window, (channel, times, values) => gathered[channel] = (times, values));
        return gathered;
    }

    // Reference: the rows kept in memory, which gather what the window collector gathers (RecentRowsTests). The rows
    // kept in temporary files must give the same samples bit for bit, over several blocks, across segment files.
    [Fact]
    public void Gathers_bit_for_bit_what_the_rows_in_memory_gather_across_blocks_and_segments()
    {
        // 40 rows × 4 columns × 8 bytes = 1280 bytes a block: segments of 3000 bytes hold three blocks.
        var onDisk = new RecentRows(new DiskRowBlocks(_folder, segmentBytes: 3000));
        var inMemory = new RecentRows();
        for (var start = 0.0; start < 400.0; start += 40.0)
        {
            AddBlock(onDisk, start, 40);
            AddBlock(inMemory, start, 40);
        }
        onDisk.Complete();
        inMemory.Complete();
        // Inside one block, across one block edge, across a segment edge (120 s), across several segments, the whole day.
        foreach (var window in new[] { new TimeWindow("w", 3.3, 17.9), new TimeWindow("w", 30.2, 55.5), new TimeWindow("w", 100.1, 140.7),
                     new TimeWindow("w", 10.5, 390.2), new TimeWindow("w", -1, 500), new TimeWindow("w", 200.4, 200.6) })
        {
            var expected = GatherAll(inMemory, window);
            var actual = GatherAll(onDisk, window);

            Assert.Equal(expected.Keys, actual.Keys);
            foreach (var channel in Channels)
            {
                Assert.Equal(expected[channel].T, actual[channel].T);
                Assert.Equal(expected[channel].V, actual[channel].V);
            }
        }
        Assert.Equal(10 * 40, GatherAll(onDisk, new TimeWindow("w", -1, 500))["a"].V.Length);
    }

    // Common practice: a killed run must leave no temporary file, so outside Windows each file is unlinked as soon as
    // it is open (its handle keeps it readable); the folder stays empty while rows are kept and read.
    [Fact]
    public void The_folder_shows_no_file_while_rows_are_kept()
    {
        if (OperatingSystem.IsWindows())
        {
            return; // there deletion on close is the system's, also for a killed process
        }
        var rows = new RecentRows(new DiskRowBlocks(_folder, segmentBytes: 3000));
        for (var start = 0.0; start < 400.0; start += 40.0)
        {
            AddBlock(rows, start, 40);
        }

        Assert.Empty(Directory.EnumerateFileSystemEntries(_folder));
        Assert.Equal(400, GatherAll(rows, new TimeWindow("w", -1, 500))["b"].V.Length);
        rows.Release();
        Assert.Empty(Directory.EnumerateFileSystemEntries(_folder));
    }

    // Common practice (bounded disk): a segment file is closed, which deletes it, once DropBefore has passed all its
    // blocks, but not while a gathered window still has channels to load from it.
    [Fact]
    public void A_segment_goes_after_DropBefore_passes_it_and_not_before_pending_loads_finish()
    {
        var store = new DiskRowBlocks(_folder, segmentBytes: 3000);
        var rows = new RecentRows(store);
        for (var start = 0.0; start < 360.0; start += 40.0)
        {
            AddBlock(rows, start, 40); // nine blocks: three segments of three blocks
        }
        Assert.Equal(3, store.OpenSegments);
        var pending = rows.Gather(new TimeWindow("w", 10.5, 100.2)); // reads the first segment (blocks 0–2)
        var reference = GatherAll(rows, new TimeWindow("w", 10.5, 100.2));

        rows.DropBefore(250.0); // passes the first two segments (blocks 0–5, last row < 240 s)

        Assert.Equal(2, store.OpenSegments); // the second goes; the first is still read by the pending window
        var loaded = pending.Channels.Select(c => c.Reduce((times, values) => (times, values: values.ToArray()))).ToList();
        Assert.Equal(1, store.OpenSegments); // its last channel is loaded: the first segment goes too
        for (var c = 0; c < Channels.Length; c++)
        {
            Assert.Equal(reference[Channels[c]].T, loaded[c].times);
            Assert.Equal(reference[Channels[c]].V, loaded[c].values);
        }

        rows.Release();
        Assert.Equal(0, store.OpenSegments);
    }

    // Common practice: the samples of a window are loaded one channel at a time, when its statistics start, and let
    // go when they are done, never the whole window at once; the channels share one array of times.
    [Fact]
    public void A_gathered_window_loads_one_channel_at_a_time()
    {
        var rows = new RecentRows(new DiskRowBlocks(_folder, segmentBytes: 3000));
        for (var start = 0.0; start < 200.0; start += 40.0)
        {
            AddBlock(rows, start, 40);
        }
        var window = rows.Gather(new TimeWindow("w", 5.5, 150.5));
        Assert.Equal(0, rows.Loaded.Now); // gathered, nothing loaded yet

        var seen = new List<(int Now, double[] Times)>();
        foreach (var channel in window.Channels)
        {
            channel.Reduce((times, values) =>
            {
                seen.Add((rows.Loaded.Now, times));
                return 0;
            });
        }

        Assert.Equal([1, 1, 1], seen.Select(s => s.Now));
        Assert.Same(seen[0].Times, seen[2].Times);
        Assert.Equal(0, rows.Loaded.Now);
        Assert.Equal(1, rows.Loaded.Peak);
    }

    // Common practice: a reduction that fails is run again for a message that names the point, after the kept rows
    // are released; it must see the same samples again.
    [Fact]
    public void A_failed_reduction_keeps_its_samples_for_the_second_one()
    {
        var rows = new RecentRows(new DiskRowBlocks(_folder, segmentBytes: 3000));
        for (var start = 0.0; start < 200.0; start += 40.0)
        {
            AddBlock(rows, start, 40);
        }
        var gathered = rows.Gather(new TimeWindow("w", 5.5, 150.5));
        var channel = gathered.Channels[1];
        ReadOnlyMemory<double>? first = null;
        Assert.Throws<InvalidOperationException>(() => channel.Reduce<int>((_, values) =>
        {
            first = values;
            throw new InvalidOperationException("fails");
        }));
        var firstCopy = first!.Value.ToArray();
        // Another channel loaded on this thread reuses the scratch the failed one was loaded into.
        Assert.Equal(firstCopy.Length, gathered.Channels[2].Reduce((_, values) => values.Length));
        rows.Release();

        var again = channel.Reduce((_, values) => values.ToArray());

        Assert.Equal(firstCopy, again);
    }

    // The command line's folder is the system's temporary one: one that does not exist fails before the read, as an
    // output failure (exit 5) that names the folder and says what to do.
    [Fact]
    public void A_missing_folder_is_an_output_failure_that_names_it()
    {
        var missing = Path.Combine(_folder, "not-there");

        var failure = Assert.Throws<BcPrepFailure>(() => new DiskRowBlocks(missing));

        Assert.Equal(FailureKind.Output, failure.Kind);
        var problem = Assert.Single(failure.Problems);
        Assert.Equal(missing, problem.Location.File);
        Assert.Contains("TMPDIR", problem.Message, StringComparison.Ordinal);
        Assert.Contains("the folder does not exist", problem.Message, StringComparison.Ordinal);
        Assert.DoesNotContain("Could not find", problem.Message, StringComparison.Ordinal); // no framework message
        Assert.DoesNotContain('\n', problem.ToString());
    }

    // A full disk shows up as a failed write in the middle of the read: the same output failure, and the segment
    // written to is let go.
    [Fact]
    public void A_failed_write_is_an_output_failure_that_names_the_folder()
    {
        var written = 0L;
        var store = new DiskRowBlocks(_folder, segmentBytes: 3000)
        {
            BeforeWrite = bytes =>
            {
                written += bytes;
                if (written > 4000)
                {
                    throw new IOException("framework words", 28); // ENOSPC, as the runtime raises it on Linux
                }
            },
        };
        var rows = new RecentRows(store);
        AddBlock(rows, 0, 40);
        AddBlock(rows, 40, 40);
        AddBlock(rows, 80, 40);

        var failure = Assert.Throws<BcPrepFailure>(() => AddBlock(rows, 120, 40));

        Assert.Equal(FailureKind.Output, failure.Kind);
        Assert.Equal(_folder, failure.Problems[0].Location.File);
        Assert.Contains("no room left on its file system", failure.Problems[0].Message, StringComparison.Ordinal);
        Assert.DoesNotContain("framework words", failure.Problems[0].Message, StringComparison.Ordinal);
        rows.Release();
        Assert.Equal(0, store.OpenSegments);
    }
}
