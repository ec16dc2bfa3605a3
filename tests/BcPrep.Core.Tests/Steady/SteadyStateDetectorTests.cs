using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

public class SteadyStateDetectorTests
{
    private const double DriftLimit = 0.05 / 60.0; // 0.05 K/min, in K/s (common practice order of magnitude)

    /// <summary>
    /// Known answer: warm-up 20 → 60 °C with τ = 300 s, then set-point steps to 70 °C at 3600 s and 80 °C at 6000 s
    /// (τ = 60 s), end at 8400 s; flow steps 1.0 → 1.2 → 1.4 kg/s at the same times (τ = 10 s). AR(1) noise φ = 0.7.
    /// </summary>
    internal static (double[] T, KeyChannel[] Channels) ThreePlateaux()
    {
        int n = 8400;
        var t = Enumerable.Range(0, n).Select(i => (double)i).ToArray();
        var temperatureNoise = SteadyTestData.Ar1(n, 0.7, 0.05, 11);
        var flowNoise = SteadyTestData.Ar1(n, 0.5, 0.004, 12);
        var temperature = new double[n];
        var flow = new double[n];
        for (int i = 0; i < n; i++)
        {
            double ti = t[i];
            double temp = 60.0 - (40.0 * Math.Exp(-ti / 300.0));
            double q = 1.0;
            if (ti >= 3600)
            {
                temp += 10.0 * (1 - Math.Exp(-(ti - 3600) / 60.0));
                q += 0.2 * (1 - Math.Exp(-(ti - 3600) / 10.0));
            }

            if (ti >= 6000)
            {
                temp += 10.0 * (1 - Math.Exp(-(ti - 6000) / 60.0));
                q += 0.2 * (1 - Math.Exp(-(ti - 6000) / 10.0));
            }

            temperature[i] = temp + temperatureNoise[i];
            flow[i] = q + flowNoise[i];
        }

        return (t, [
            new KeyChannel("T_in", temperature, DriftLimit, 0.2, 1.0),
            new KeyChannel("m_dot", flow, 1e-4, 0.02, 0.05),
        ]);
    }

    [Fact]
    public void Finds_the_three_plateaux_inside_their_true_extent_and_skips_the_warm_up()
    {
        var (t, channels) = ThreePlateaux();
        var result = SteadyStateDetector.Detect(t, channels, new SteadySettings());

        Assert.Equal(3, result.Accepted.Count);
        double[] plateauStart = [1800, 3600 + 400, 6000 + 400]; // drift below limit: τ·ln(A/(τ·limit)) + margin
        double[] plateauEnd = [3600, 6000, 8400];
        double[] level = [60, 70, 80];
        for (int k = 0; k < 3; k++)
        {
            var w = result.Accepted[k];
            Assert.InRange(w.StartS, plateauStart[k], plateauEnd[k]);
            Assert.InRange(w.EndS, plateauStart[k], plateauEnd[k]);
            Assert.Equal(300.0, w.EndS - w.StartS, 1.0);
            Assert.True(w.AcceptedBy.HasFlag(SteadyMethod.DriftScatter));
            Assert.Equal(level[k], w.Channels[0].Mean, 0.05);
            Assert.All(w.Channels, c => Assert.DoesNotContain(c.Failures, f => f.Criterion is SteadyCriterion.Drift or SteadyCriterion.Scatter));
        }

        // The warm-up is rejected for drift.
        var warmUp = result.Rejected[0];
        Assert.Equal(0.0, warmUp.StartS);
        Assert.Contains(warmUp.Channels[0].Failures, f => f.Criterion == SteadyCriterion.Drift);
    }

    [Fact]
    public void Slowly_drifting_plateau_is_rejected_for_drift_with_its_size()
    {
        int n = 3000;
        var t = Enumerable.Range(0, n).Select(i => (double)i).ToArray();
        var noise = SteadyTestData.Ar1(n, 0.7, 0.05, 21);
        var drift = 0.002; // K/s = 0.12 K/min, 2.4× the limit
        var values = t.Select((ti, i) => 50.0 + (drift * ti) + noise[i]).ToArray();
        var channel = new KeyChannel("T_out", values, DriftLimit, 1.0, 5.0);

        var result = SteadyStateDetector.Detect(t, [channel], new SteadySettings());

        Assert.Empty(result.Accepted);
        var rejected = Assert.Single(result.Rejected);
        var failure = Assert.Single(rejected.Channels[0].Failures);
        Assert.Equal(SteadyCriterion.Drift, failure.Criterion);
        Assert.InRange(rejected.Channels[0].SlopePerS, 0.8 * drift, 1.2 * drift);
        Assert.Contains("slope beyond limit", rejected.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Small_set_point_step_inside_a_steady_run_splits_it()
    {
        // A 0.3 K step passes the drift test on most windows (noise-free here to make the run continuous) but exceeds
        // the 0.2 K step threshold: two operating points, not one averaged across the step.
        int n = 3000;
        var t = Enumerable.Range(0, n).Select(i => (double)i).ToArray();
        var noise = SteadyTestData.Ar1(n, 0.3, 0.01, 5);
        var values = t.Select((ti, i) => (ti < 1500 ? 40.0 : 40.3) + noise[i]).ToArray();
        var channel = new KeyChannel("T", values, 0.01, 0.5, 0.2);

        var result = SteadyStateDetector.Detect(t, [channel], new SteadySettings());

        Assert.Equal(2, result.Accepted.Count);
        Assert.True(result.Accepted[0].EndS <= 1500);
        Assert.True(result.Accepted[1].StartS >= 1500);
        Assert.Equal(40.0, result.Accepted[0].Channels[0].Mean, 0.01);
        Assert.Equal(40.3, result.Accepted[1].Channels[0].Mean, 0.01);
    }

    [Fact]
    public void Mismatched_lengths_are_refused()
    {
        var channel = new KeyChannel("T", [1.0, 2.0], 1, 1, 1);
        Assert.Throws<ArgumentException>(() => SteadyStateDetector.Detect([0.0, 1.0, 2.0], [channel], new SteadySettings()));
    }
}
