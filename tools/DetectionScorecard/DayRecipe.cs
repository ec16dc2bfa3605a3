namespace BcPrep.Tools.Scorecard;

/// <summary>One operating point of a generated day: fan and heater setting from StartS on.</summary>
public sealed record PlannedPoint(double StartS, double MassFlowKgS, double HeaterPowerW);

/// <summary>A gap planted in a steady period: in one channel (empty cells) or in all (missing rows).</summary>
public sealed record PlantedGap(double StartS, double DurationS, string? Column);

/// <summary>
/// Everything random about one generated day, drawn from its seed, so a day is reproduced from the seed alone.
/// The ranges are those of the detection scorecard (issue 18): 2–4 points with flow and heater steps; wall and
/// outlet time constants 3–10 min, inlet about 1 min, pressures seconds; AR(1) noise with lag-1 correlation
/// 0.5–0.95 per sample; spikes on 0.01–0.1 % of samples, 1–3 samples long, 25–1000 σ; gaps of 1–5 s in one
/// channel and in all channels inside steady periods; 10 Hz to 1 kHz with mains hum at the higher rates; a slow
/// zero drift on one pressure transducer. The responses are first-order lags, two lags in series, or a lag with a
/// slow creep, and the flow may overshoot (<see cref="DayShapes"/>).
/// </summary>
public sealed record DayRecipe(
    int Seed,
    double RateHz,
    double DurationS,
    bool StartsSettled,
    IReadOnlyList<PlannedPoint> Points,
    double FlowTauS,
    double InletTauS,
    double OutletTauS,
    IReadOnlyList<double> WallTauS,
    double AmbientDriftKPerH,
    double NoisePhi,
    double SpikeFraction,
    double MainsHumSigmas,
    string DriftingPressureColumn,
    double PressureZeroDriftPaPerH,
    IReadOnlyList<PlantedGap> Gaps)
{
    /// <summary>The response shapes of the day (<see cref="DayShapes"/>); first-order lags unless drawn.</summary>
    public DayShapes Shapes { get; init; } = DayShapes.FirstOrder;

    /// <summary>The rates a day may have; the high ones are few and short so the scorecard runs in minutes.</summary>
    private static readonly double[] Rates = [10, 10, 10, 10, 10, 10, 20, 20, 50, 50, 100, 200, 500, 1000];

    public static DayRecipe Draw(int seed)
    {
        var random = new Random(seed);
        var rate = Rates[random.Next(Rates.Length)];
        var fast = rate >= 200;
        var pointCount = fast ? 2 : 2 + random.Next(3);
        var wallTau = (fast ? Uniform(random, 180, 240) : Uniform(random, 180, 600));
        var walls = Enumerable.Range(0, 4).Select(_ => wallTau * Uniform(random, 0.7, 1.0)).ToArray();
        walls[random.Next(4)] = wallTau; // one wall thermocouple is the slowest, at a random position
        var outletTau = Math.Max(180, wallTau * Uniform(random, 0.75, 0.95));
        var startsSettled = fast || random.NextDouble() < 0.25;
        var restS = startsSettled ? 0.0 : Uniform(random, 120, 360);

        var settings = new List<(double Flow, double Power)>();
        for (var i = 0; i < pointCount; i++)
        {
            while (true)
            {
                var flow = Math.Round(Uniform(random, 0.015, 0.045), 4);
                var power = Math.Round(Uniform(random, 300, 1400), 0);
                if (fast && i > 0)
                {
                    // A small step keeps the fast days short: a few kelvin to settle, not tens.
                    flow = settings[^1].Flow * Uniform(random, 1.08, 1.15);
                    power = settings[^1].Power * Uniform(random, 1.05, 1.12);
                }
                // The fast days' small step (8–15 % of the flow) is a step by construction.
                var differs = settings.Count == 0 || (fast && i > 0) || Math.Abs(flow - settings[^1].Flow) >= 0.003 || Math.Abs(power - settings[^1].Power) >= 150;
                if (differs)
                {
                    settings.Add((flow, power));
                    break;
                }
            }
        }

        var points = new List<PlannedPoint>();
        var recipe = new DayRecipe(seed, rate, 0, startsSettled, points, Uniform(random, 5, 20), Uniform(random, 45, 75), outletTau, walls,
            Uniform(random, -0.2, 0.2), Uniform(random, 0.5, 0.95), Uniform(random, 1e-4, 1e-3), fast ? Uniform(random, 1, 5) : 0.0,
            random.NextDouble() < 0.5 ? "PT_IN_V" : "PT_OUT_V", Uniform(random, -3, 3), [])
        { Shapes = DayShapes.Draw(seed) };

        // Place each step after the previous point has settled and stayed steady for a while (10–25 min; 8–10 min on
        // the fast days). The settling time comes from the noise-free model itself.
        var start = restS;
        for (var i = 0; i < pointCount; i++)
        {
            points.Add(new PlannedPoint(start, settings[i].Flow, settings[i].Power));
            var settle = start == 0 && startsSettled ? 0 : Trajectory.SettlingSpanS(recipe with { Points = points }, i);
            var steady = fast ? Uniform(random, 480, 600) : Uniform(random, 600, 1500);
            start += settle + steady;
        }
        var duration = start;
        recipe = recipe with { Points = points, DurationS = duration };

        var gaps = new List<PlantedGap>();
        var truth = DayTruth.Of(recipe);
        string[] gappable = ["PBARO_V", "PT_IN_V", "PT_OUT_V", "FM_MA", "TC_IN_MV", "TC_OUT_MV", "TC_W1_MV", "TC_W2_MV", "TC_W3_MV", "TC_W4_MV", "HTR_V_SIG", "HTR_I_SIG"];
        foreach (var w in truth.Windows)
        {
            // Inside the steady period, away from its ends, so the truth window stays what it is.
            if (random.NextDouble() < 0.6)
            {
                gaps.Add(new PlantedGap(Uniform(random, w.SettledS + 60, w.EndS - 60), Uniform(random, 1, 5), gappable[random.Next(gappable.Length)]));
            }
            if (random.NextDouble() < 0.35)
            {
                gaps.Add(new PlantedGap(Uniform(random, w.SettledS + 60, w.EndS - 60), Uniform(random, 1, 5), null));
            }
        }
        return recipe with { Gaps = gaps };
    }

    private static double Uniform(Random random, double low, double high) => low + ((high - low) * random.NextDouble());
}
