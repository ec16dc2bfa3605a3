using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

public class SteadyScanTests
{
    // Reference: the detector's own definition over the whole series (SteadyStateDetector.Detect). Fed one block
    // mean at a time, a plateau must be accepted soon after the day leaves it, with the window it has at the end.
    [Fact]
    public void Accepts_each_plateau_once_it_has_ended_with_the_window_of_the_whole_series()
    {
        var (t, channels) = SteadyStateDetectorTests.ThreePlateaux();
        var settings = new SteadySettings();
        var whole = SteadyStateDetector.Detect(t, channels, settings);
        var scan = new SteadyScan(channels, settings);
        var acceptedAtS = new List<double>();
        var row = new double[channels.Length];
        for (var i = 0; i < t.Length; i++)
        {
            for (var c = 0; c < channels.Length; c++)
            {
                row[c] = channels[c].Values[i];
            }
            scan.Add(t[i], row);
            while (acceptedAtS.Count < scan.Accepted.Count)
            {
                acceptedAtS.Add(t[i]);
            }
            // What is accepted so far is always the beginning of the whole series' answer.
            Assert.True(scan.Accepted.Count <= whole.Accepted.Count);
            for (var k = 0; k < scan.Accepted.Count; k++)
            {
                Assert.Equal(whole.Accepted[k].StartS, scan.Accepted[k].StartS);
                Assert.Equal(whole.Accepted[k].EndS, scan.Accepted[k].EndS);
            }
        }
        var finished = scan.Finish();

        Assert.Equal(whole.Accepted.Select(w => (w.StartS, w.EndS, w.AcceptedBy)), finished.Accepted.Select(w => (w.StartS, w.EndS, w.AcceptedBy)));
        Assert.Equal(whole.Rejected.Select(r => (r.StartS, r.EndS, r.Reason)), finished.Rejected.Select(r => (r.StartS, r.EndS, r.Reason)));
        // The plateaux ending at 3600 s and 6000 s are known within a test window and a step of their end (300 s
        // and 10 s); the last one only when the series ends.
        Assert.Equal(2, acceptedAtS.Count);
        Assert.InRange(acceptedAtS[0], 3600, 3600 + settings.WindowS + settings.StepS);
        Assert.InRange(acceptedAtS[1], 6000, 6000 + settings.WindowS + settings.StepS);
    }

    [Fact]
    public void A_time_that_does_not_increase_is_refused()
    {
        var (_, channels) = SteadyStateDetectorTests.ThreePlateaux();
        var scan = new SteadyScan(channels, new SteadySettings());
        scan.Add(10.0, [60.0, 1.0]);

        Assert.Throws<BcPrepDataException>(() => scan.Add(10.0, [60.0, 1.0]));
    }

    [Fact]
    public void Invalid_settings_are_refused_before_the_first_block_mean()
    {
        var (_, channels) = SteadyStateDetectorTests.ThreePlateaux();

        Assert.Throws<BcPrepDataException>(() => new SteadyScan(channels, new SteadySettings(StepS: 0.0)));
    }
}
