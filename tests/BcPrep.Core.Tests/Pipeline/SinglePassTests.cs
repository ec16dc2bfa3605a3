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
        Assert.Equal(0, single.WindowsReadAgain);
        Assert.Equal(3, twoPasses.WindowsReadAgain);
        AssertSamePoints(twoPasses, single);
    }

    // The sample rig pins its three points, which replace the detected windows they overlap: nothing is gathered
    // ahead, nothing is read again, and the results are those of the two-pass path.
    [Fact]
    public void Pinned_points_are_unaffected()
    {
        var rig = RigLoader.Load(File.ReadAllText(Tests.Rig.RigLoaderTests.SampleRigPath), Tests.Rig.RigLoaderTests.SampleRigPath);

        var single = DayProcessor.Process(rig, SampleDay(), new ProcessOptions());
        var twoPasses = DayProcessor.Process(rig, SampleDay(), new ProcessOptions { SinglePass = false });

        Assert.All(single.Points, p => Assert.Equal(WindowOrigin.RigFile, p.Origin));
        Assert.Equal(0, single.WindowsReadAgain);
        AssertSamePoints(twoPasses, single);
    }

    private static void AssertSamePoints(DayResult expected, DayResult actual)
    {
        Assert.Equal(expected.Points.Select(p => p.Window), actual.Points.Select(p => p.Window));
        for (var i = 0; i < expected.Points.Count; i++)
        {
            foreach (var (channel, reference) in expected.Points[i].Channels)
            {
                var stats = actual.Points[i].Channels[channel];
                Assert.Equal(reference.SampleCount, stats.SampleCount);
                Assert.Equal(reference.SpikesReplaced, stats.SpikesReplaced);
                Assert.Equal(reference.Mean, stats.Mean);
                Assert.Equal(reference.StandardDeviation, stats.StandardDeviation);
                Assert.Equal(reference.TypeA.StandardUncertainty, stats.TypeA.StandardUncertainty);
            }
            Assert.Equal(expected.Points[i].Gum.Outputs.Select(o => (o.Estimate, o.ExpandedUncertainty)), actual.Points[i].Gum.Outputs.Select(o => (o.Estimate, o.ExpandedUncertainty)));
        }
    }
}
