using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class ChannelConditionerTests
{
    [Fact]
    public void Chain_bridges_removes_spikes_and_filters_each_segment()
    {
        const double fs = 1000.0;
        int n = 20000;
        var t = new double[n];
        var x = new double[n];
        for (int i = 0; i < n; i++)
        {
            t[i] = i / fs;
            x[i] = 5.0 + (0.2 * Math.Sin(2 * Math.PI * 50.0 * t[i]));
        }

        x[3000] = 80.0;                           // spike
        x[5000] = double.NaN;                     // short gap → bridged
        for (int i = 10000; i < 10500; i++)
        {
            x[i] = double.NaN;                    // 0.5 s gap → not bridged, splits segments
        }

        var settings = new ConditioningSettings(MaxBridgeS: 0.01, LowPassCutoffHz: 20.0);
        var r = ChannelConditioner.Condition(t, x, settings);

        Assert.Equal(1, r.Report.SpikesReplaced);
        Assert.Equal(3.0, r.Report.SpikeTimesS[0], 1e-12);
        Assert.Single(r.Report.Gaps.Bridged);
        Assert.Single(r.Report.Gaps.Unbridged);
        Assert.Equal(2, r.Report.FilteredSegments);
        Assert.Equal([50.0, 100.0, 150.0], r.Report.NotchFrequenciesHz);
        Assert.True(double.IsNaN(r.Values[10200]));
        // Away from the edges, the replaced spike and the bridged cell, mains is gone and the level kept.
        foreach (int i in Enumerable.Range(1000, 1000).Concat(Enumerable.Range(6500, 2500)).Concat(Enumerable.Range(12000, 6000)))
        {
            Assert.True(Math.Abs(r.Values[i] - 5.0) < 1e-3, $"{i} {r.Values[i]}");
        }

        // The Hampel median of a 50 Hz wave is not the wave itself: a small residue stays near the spike, far below 80.
        Assert.InRange(r.Values[3000], 4.8, 5.2);
    }
}
