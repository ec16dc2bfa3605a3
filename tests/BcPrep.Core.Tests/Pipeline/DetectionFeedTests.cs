using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

public class DetectionFeedTests
{
    private static readonly string[] Logs = Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal).ToArray();

    private static RigDescription SampleRig(string conditioning, bool pinned = false) =>
        RigLoader.Load(File.ReadAllText(pinned ? Tests.Rig.RigLoaderTests.PinnedSampleRigPath : Tests.Rig.RigLoaderTests.SampleRigPath) + "\n[conditioning]\n" + conditioning + "\n", "rig.toml");

    [Fact]
    public void Block_means_lose_the_spikes_with_or_without_a_low_pass()
    {
        // tools/SampleDay plants a +150 Pa spike on p_in at t = 2000 s (one sample of a 2 Hz log, so +75 Pa on that
        // 1 s block mean if it were left in). Hampel replaces it before the block means are formed: without a filter
        // on the raw samples (DespikedBlockFeed), with a low-pass in the conditioning chain. (Issue 18 asks for the
        // first; before it, the block means without a filter kept the spike.)
        var plain = WindowFinder.Find(SampleRig("lowpass_cutoff = \"none\""), Logs.Select(LogInput.FromPath).ToList());
        var filtered = WindowFinder.Find(SampleRig("lowpass_cutoff = \"0.2 Hz\""), Logs.Select(LogInput.FromPath).ToList());

        static double Jump(DayWindows day, int block)
        {
            var p = day.Blocks.Means["p_in"];
            return p[block] - (0.5 * (p[block - 3] + p[block + 3]));
        }
        var spikeBlock = 2000;
        Assert.InRange(Math.Abs(Jump(plain, spikeBlock)), 0.0, 2.0);
        Assert.InRange(Math.Abs(Jump(filtered, spikeBlock)), 0.0, 2.0);
        Assert.Equal(plain.Detection.Accepted.Count, filtered.Detection.Accepted.Count);
    }

    [Fact]
    public void Window_means_and_Type_A_ignore_the_low_pass()
    {
        // The filters serve detection and plots only: a low-pass narrows the scatter and would understate Type A. The
        // windows are pinned (the filtered block means may move a detected window by a few seconds).
        var logs = Logs.Select(LogInput.FromPath).ToList();
        var plain = DayProcessor.Process(SampleRig("lowpass_cutoff = \"none\"", pinned: true), logs, new ProcessOptions());
        var filtered = DayProcessor.Process(SampleRig("lowpass_cutoff = \"0.2 Hz\"", pinned: true), logs, new ProcessOptions());

        var a = plain.Points.Single(p => p.Id == "OP2").Channels["t_out"];
        var b = filtered.Points.Single(p => p.Id == "OP2").Channels["t_out"];
        Assert.Equal(a.Mean, b.Mean);
        Assert.Equal(a.TypeA.StandardUncertainty, b.TypeA.StandardUncertainty);
    }
}
