using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

public class PlateauDetectorTests
{
    /// <summary>
    /// Two operating points, 1 s blocks: a flow step 1.0 → 1.2 and a wall approach 60 → 70 (τ = 300 s) at 3600 s,
    /// end at 7200 s; AR(1) noise (φ = 0.7) of 0.02 on the wall and 0.002 on the flow. Wall tolerance 0.2, flow 0.01.
    /// True settle of point 2: 3600 + 300·ln(10/0.2) = 4773.6 s (wall), the flow long before.
    /// </summary>
    private static (double[] T, KeyChannel[] Channels) TwoPoints(Action<double[], double[]>? spoil = null)
    {
        var n = 7200;
        var t = Enumerable.Range(0, n).Select(i => i + 0.5).ToArray();
        var wallNoise = SteadyTestData.Ar1(n, 0.7, 0.02, 21);
        var flowNoise = SteadyTestData.Ar1(n, 0.7, 0.002, 22);
        var wall = new double[n];
        var flow = new double[n];
        for (var i = 0; i < n; i++)
        {
            var after = t[i] >= 3600;
            wall[i] = 60.0 + (after ? 10.0 * (1 - Math.Exp(-(t[i] - 3600) / 300.0)) : 0.0) + wallNoise[i];
            flow[i] = 1.0 + (after ? 0.2 * (1 - Math.Exp(-(t[i] - 3600) / 5.0)) : 0.0) + flowNoise[i];
        }
        spoil?.Invoke(wall, flow);
        var channels = new[]
        {
            new KeyChannel("flow", flow, double.PositiveInfinity, double.PositiveInfinity, double.Epsilon) { Tolerance = _ => 0.01 },
            new KeyChannel("wall", wall, double.PositiveInfinity, double.PositiveInfinity, double.Epsilon) { Tolerance = _ => 0.2, MarksSteps = false },
        };
        return (t, channels);
    }

    private static readonly SteadySettings Settings = new(WindowS: 300, MinStretchS: 300, TailS: 300);

    [Fact]
    public void Each_plateau_gives_one_window_from_its_settled_moment_to_the_next_step()
    {
        var (t, channels) = TwoPoints();
        var result = PlateauDetector.Detect(t, channels, Settings);
        Assert.Equal(2, result.Accepted.Count);
        var second = result.Accepted[1];
        // Settled moment with the 0.9 margin: 3600 + 300·ln(10/0.18) = 4805.2 s; ±15 s for the noise (common practice).
        Assert.InRange(second.StartS, 4773.6, 4825.0);
        Assert.Equal(7200.0, second.EndS, 6);
        Assert.InRange(result.Accepted[0].EndS, 3590.0, 3600.0); // ends before the step, never after it
        Assert.InRange(second.Channels.Single(c => c.Channel == "wall").TauS, 290.0, 310.0);
    }

    [Fact]
    public void Spikes_in_the_block_means_neither_split_nor_shift_a_plateau()
    {
        // 1000 σ spikes on single blocks, in both channels, inside both plateaus.
        var (t, channels) = TwoPoints((wall, flow) =>
        {
            foreach (var i in new[] { 1000, 2500, 5500, 6800 })
            {
                wall[i] += 20.0;
                flow[i] -= 2.0;
            }
        });
        var result = PlateauDetector.Detect(t, channels, Settings);
        Assert.Equal(2, result.Accepted.Count);
        Assert.InRange(result.Accepted[1].StartS, 4773.6, 4825.0);
    }

    [Fact]
    public void A_gap_in_all_channels_neither_splits_nor_extends_a_plateau()
    {
        var (t, channels) = TwoPoints((wall, flow) =>
        {
            for (var i = 6000; i < 6005; i++)
            {
                wall[i] = double.NaN;
                flow[i] = double.NaN;
            }
            for (var i = 2000; i < 2004; i++)
            {
                wall[i] = double.NaN;
            }
        });
        var result = PlateauDetector.Detect(t, channels, Settings);
        Assert.Equal(2, result.Accepted.Count);
        Assert.Equal(7200.0, result.Accepted[1].EndS, 6);
    }

    [Fact]
    public void A_channel_still_approaching_at_the_plateau_end_is_rejected_with_its_remaining_change()
    {
        // τ = 3000 s on the wall: at the end (3600 s after the step) 10·e^(−1.2) = 3.0 is still to come.
        var n = 7200;
        var t = Enumerable.Range(0, n).Select(i => i + 0.5).ToArray();
        var noise = SteadyTestData.Ar1(n, 0.7, 0.02, 23);
        var wall = t.Select((ti, i) => 60.0 + (ti >= 3600 ? 10.0 * (1 - Math.Exp(-(ti - 3600) / 3000.0)) : 0.0) + noise[i]).ToArray();
        var flow = t.Select(ti => ti >= 3600 ? 1.2 : 1.0).ToArray();
        var channels = new[]
        {
            new KeyChannel("flow", flow, double.PositiveInfinity, double.PositiveInfinity, double.Epsilon) { Tolerance = _ => 0.01 },
            new KeyChannel("wall", wall, double.PositiveInfinity, double.PositiveInfinity, double.Epsilon) { Tolerance = _ => 0.2, MarksSteps = false },
        };
        var result = PlateauDetector.Detect(t, channels, Settings);
        Assert.Single(result.Accepted);
        Assert.Contains(result.Rejected, r => r.Reason.Contains("wall: predicted remaining change", StringComparison.Ordinal));
    }

    [Fact]
    public void A_curve_slower_than_its_plateau_is_judged_by_its_drift_not_by_slope_times_tau()
    {
        // One plateau of 600 s (the day's first: no step before it) whose wall follows 0.35·(1 − exp(−t/1200 s)):
        // it moves 0.14 over the plateau, within the tolerance 0.2, while |slope|·τ at its end reads 0.21. Less than
        // one time constant is in view, so the curve cannot be told from a drift (on a settled plateau of
        // autocorrelated noise the fit finds such curves): the drift rule decides, and the plateau is settled from
        // its start. Before, the fit's 0.21 > 0.2 rejected a plateau that never left its tolerance band.
        var n = 600;
        var t = Enumerable.Range(0, n).Select(i => i + 0.5).ToArray();
        var noise = SteadyTestData.Ar1(n, 0.7, 0.005, 31);
        var wall = t.Select((x, i) => 60.0 + (0.35 * (1 - Math.Exp(-x / 1200.0))) + noise[i]).ToArray();
        var flow = SteadyTestData.Ar1(n, 0.7, 0.002, 32).Select(v => 1.0 + v).ToArray();
        var channels = new[]
        {
            new KeyChannel("flow", flow, double.PositiveInfinity, double.PositiveInfinity, double.Epsilon) { Tolerance = _ => 0.01 },
            new KeyChannel("wall", wall, double.PositiveInfinity, double.PositiveInfinity, double.Epsilon) { Tolerance = _ => 0.2, MarksSteps = false },
        };

        var result = PlateauDetector.Detect(t, channels, Settings);

        var window = Assert.Single(result.Accepted);
        Assert.Equal(0.0, window.StartS, 6);
    }
}
