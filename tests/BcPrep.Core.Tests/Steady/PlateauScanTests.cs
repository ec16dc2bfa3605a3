using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

public class PlateauScanTests
{
    private static readonly SteadySettings Settings = new(WindowS: 300, MinStretchS: 600, TailS: 300);

    /// <summary>
    /// A generated day of 1 s block means: the rig at rest for the first 10 min, then 2–4 operating points with flow
    /// and heater steps; the wall follows each step with τ of 3–10 min, the flow within seconds; AR(1) noise
    /// (φ 0.5–0.95); single-block spikes of 25–1000 σ; gaps of 2–40 blocks in one channel or in all. Every seed
    /// draws another day (common practice: the shapes the detection scorecard's days have, at block level).
    /// </summary>
    private static (double[] T, KeyChannel[] Channels) Day(int seed)
    {
        var rng = new Random(seed);
        var points = rng.Next(2, 5);
        var plateauS = Enumerable.Range(0, points).Select(_ => 1800 + rng.Next(0, 1800)).ToArray();
        var n = 600 + plateauS.Sum();
        var t = Enumerable.Range(0, n).Select(i => i + 0.5).ToArray();
        var phi = 0.5 + (0.45 * rng.NextDouble());
        var flowNoise = SteadyTestData.Ar1(n, phi, 0.002, seed * 10 + 1);
        var wallNoise = SteadyTestData.Ar1(n, phi, 0.03, seed * 10 + 2);
        var heaterNoise = SteadyTestData.Ar1(n, 0.3, 0.5, seed * 10 + 3);
        var flow = new double[n];
        var wall = new double[n];
        var heater = new double[n];
        var (flowFrom, flowTo, wallFrom, wallTo, powerTo, stepS, tauS) = (0.0, 0.0, 300.0, 300.0, 0.0, 0.0, 300.0);
        var nextStep = 600;
        var p = -1;
        for (var i = 0; i < n; i++)
        {
            if (i == nextStep)
            {
                p++;
                (flowFrom, wallFrom, stepS) = (flowFrom + ((flowTo - flowFrom) * (1 - Math.Exp(-(t[i] - stepS) / 5.0))), wallFrom + ((wallTo - wallFrom) * (1 - Math.Exp(-(t[i] - stepS) / tauS))), t[i]);
                flowTo = 0.5 + (0.1 * rng.Next(0, 10));
                powerTo = 200 + (100 * rng.Next(0, 10));
                wallTo = 300 + (powerTo / (20 * flowTo));
                tauS = 180 + rng.Next(0, 420);
                nextStep += plateauS[p];
            }
            var since = t[i] - stepS;
            flow[i] = flowFrom + ((flowTo - flowFrom) * (1 - Math.Exp(-since / 5.0))) + flowNoise[i];
            wall[i] = wallFrom + ((wallTo - wallFrom) * (1 - Math.Exp(-since / tauS))) + wallNoise[i];
            heater[i] = powerTo + heaterNoise[i];
        }
        foreach (var series in new[] { flow, wall, heater })
        {
            for (var s = 0; s < n / 2000; s++)
            {
                var i = rng.Next(n);
                series[i] += (rng.Next(2) == 0 ? -1 : 1) * (25 + rng.Next(0, 975)) * (series == flow ? 0.002 : series == wall ? 0.03 : 0.5);
            }
        }
        for (var g = 0; g < 4; g++)
        {
            var start = rng.Next(n - 50);
            var length = rng.Next(2, 40);
            var all = rng.Next(2) == 0;
            var only = rng.Next(3);
            for (var i = start; i < start + length; i++)
            {
                foreach (var (series, index) in new[] { (flow, 0), (wall, 1), (heater, 2) })
                {
                    if (all || index == only)
                    {
                        series[i] = double.NaN;
                    }
                }
            }
        }
        var channels = new[]
        {
            new KeyChannel("flow", flow, double.PositiveInfinity, double.PositiveInfinity, double.Epsilon) { Tolerance = _ => 0.004, RestFractionOfLargest = 0.05 },
            new KeyChannel("wall", wall, double.PositiveInfinity, double.PositiveInfinity, double.Epsilon) { Tolerance = level => 0.2 + (0.001 * (level - 300)), MarksSteps = false },
            new KeyChannel("heater", heater, double.PositiveInfinity, double.PositiveInfinity, double.Epsilon) { StepOnly = true },
        };
        return (t, channels);
    }

    private static IEnumerable<string> Describe(SteadyDetectionResult result) =>
        result.Accepted.Select(w => FormattableString.Invariant($"accepted {w.StartS:R} {w.EndS:R} {w.StretchStartS:R} {w.StretchEndS:R} {w.AcceptedBy} ") + Channels(w.Channels))
            .Concat(result.Rejected.Select(r => FormattableString.Invariant($"rejected {r.StartS:R} {r.EndS:R} {r.EvaluatedStartS:R} {r.EvaluatedEndS:R} {r.Reason} ") + Channels(r.Channels)));

    private static string Channels(IReadOnlyList<ChannelCriteria> channels) =>
        string.Join(" | ", channels.Select(c => FormattableString.Invariant($"{c.Channel} {c.Mean:R} {c.StandardDeviation:R} {c.TauS:R} {c.SettledSinceS:R} {c.RemainingChange:R} {c.Tolerance:R} {c.Failures.Count}")));

    // Reference: the detector's own definition over the whole day (PlateauDetector.Detect judges every plateau once all
    // blocks are in). Fed one block at a time and judging as it goes, the scan must give the same result to the bit,
    // rejected stretches included.
    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    [InlineData(6)]
    public void Fed_one_block_at_a_time_it_equals_the_whole_day_detection(int seed)
    {
        var (t, channels) = Day(seed);
        var whole = PlateauDetector.Detect(t, channels, Settings, 1.0);

        var scan = new PlateauScan(channels, Settings, 1.0);
        var row = new double[channels.Length];
        var judgedAt = new List<int>();
        var openSince = new List<double>();
        for (var i = 0; i < t.Length; i++)
        {
            for (var c = 0; c < channels.Length; c++)
            {
                row[c] = channels[c].Values[i];
            }
            scan.Add(t[i], row);
            openSince.Add(scan.OpenSinceS);
            while (judgedAt.Count < scan.Judged.Count)
            {
                judgedAt.Add(i);
            }
        }
        var streamed = scan.Finish();

        Assert.Equal(Describe(whole), Describe(streamed));
        Assert.NotEmpty(whole.Accepted);
        // Plateaus are judged during the read, not only at its end: all but the day's last one.
        Assert.NotEmpty(judgedAt);
        Assert.Equal(judgedAt.Count, scan.Judged.Count(w => w.StretchEndS < t[^1]));
        // No window judged starts before the moment the scan said rows were still needed from, at any earlier block.
        for (var w = 0; w < scan.Judged.Count; w++)
        {
            var until = w < judgedAt.Count ? judgedAt[w] : t.Length - 1;
            for (var i = 0; i < until; i++)
            {
                Assert.True(openSince[i] <= scan.Judged[w].StartS, FormattableString.Invariant($"window {w} starts at {scan.Judged[w].StartS} s, before {openSince[i]} s, which block {i} said"));
            }
        }
    }
}
