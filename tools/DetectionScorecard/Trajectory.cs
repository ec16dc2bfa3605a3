using BcPrep.Tools.SampleDay;

namespace BcPrep.Tools.Scorecard;

/// <summary>
/// The noise-free state of a generated day: every quantity follows its <see cref="Response"/> toward the target of
/// the point in force (a first-order lag, x(t) = T + (x(S) − T)·exp(−(t − S)/τ), or the day's other shape for the
/// outlet, the walls and the flow, <see cref="DayShapes"/>), exact at any sample rate. Temperatures are ambient plus a
/// rise; ambient drifts linearly.
/// </summary>
public sealed class Trajectory
{
    /// <summary>Nominal ambient (K) and barometric pressure (Pa) at the day's first sample.</summary>
    public const double AmbientK = 294.45;
    public const double BarometerPa = 98_650.0;

    // Quantities: 0 mass flow, 1 heater power, 2 inlet rise (fan work), 3 outlet rise, 4.. wall rises.
    private const int Walls = 4;
    private const int Count = 4 + Walls;
    private readonly DayRecipe _recipe;
    private readonly Response[] _responses;
    private readonly double[][] _targets;
    private readonly (double A, double B)[][] _startStates;

    public Trajectory(DayRecipe recipe)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        _recipe = recipe;
        var shapes = recipe.Shapes;
        _responses = [shapes.FlowResponse(recipe.FlowTauS), new FirstOrder(2.0), new FirstOrder(recipe.InletTauS), shapes.ThermalResponse(recipe.OutletTauS),
            .. recipe.WallTauS.Select(shapes.ThermalResponse)];
        _targets = recipe.Points.Select(Targets).ToArray();
        _startStates = new (double A, double B)[recipe.Points.Count][];
        for (var k = 0; k < recipe.Points.Count; k++)
        {
            if (k == 0)
            {
                var settled = recipe.StartsSettled && recipe.Points[0].StartS == 0;
                _startStates[0] = [.. _responses.Select((r, q) => r.Rest(settled ? _targets[0][q] : 0.0))];
                continue;
            }
            var span = recipe.Points[k].StartS - recipe.Points[k - 1].StartS;
            _startStates[k] = Advance(_startStates[k - 1], _targets[k - 1], span);
        }
    }

    /// <summary>The noise-free state at time t (s since the first sample).</summary>
    public State At(double timeS)
    {
        var k = _recipe.Points.Count - 1;
        while (k >= 0 && _recipe.Points[k].StartS > timeS)
        {
            k--;
        }
        var x = k < 0 ? new double[Count] : Values(Advance(_startStates[k], _targets[k], timeS - _recipe.Points[k].StartS));
        var ambient = AmbientK + (_recipe.AmbientDriftKPerH * timeS / 3600.0);
        return new State(x[0], x[1], ambient + x[2], ambient + x[3], [.. x.Skip(4).Select(r => ambient + r)]);
    }

    /// <summary>
    /// Seconds after point <paramref name="index"/>'s step until the flow, the outlet and every wall stay within their
    /// tolerance (<see cref="DayTruth"/>) of the point's targets: the last time, on a 1 s grid up to 15 of the
    /// slowest time constants, that a key quantity is outside it (an overshoot may leave and re-enter the band).
    /// </summary>
    public static double SettlingSpanS(DayRecipe recipe, int index)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        var trajectory = new Trajectory(recipe);
        var start = trajectory._startStates[index];
        var target = trajectory._targets[index];
        var span = 0.0;
        foreach (var q in KeyQuantities)
        {
            var response = trajectory._responses[q];
            var tolerance = q == 0 ? DayTruth.FlowToleranceKgS(target[0]) : DayTruth.TemperatureToleranceK(AmbientK + target[q]);
            var horizon = Math.Ceiling(15 * response.SlowestTauS);
            for (var t = horizon; t >= 0; t--)
            {
                if (Math.Abs(response.Value(response.Advance(start[q], target[q], t)) - target[q]) > tolerance)
                {
                    span = Math.Max(span, t + 1);
                    break;
                }
            }
        }
        return span;
    }

    /// <summary>The key quantities of the truth: mass flow, outlet bulk temperature and every wall thermocouple.</summary>
    private static readonly int[] KeyQuantities = [0, 3, 4, 5, 6, 7];

    private (double A, double B)[] Advance((double A, double B)[] from, double[] target, double spanS)
    {
        var x = new (double A, double B)[Count];
        for (var q = 0; q < Count; q++)
        {
            x[q] = _responses[q].Advance(from[q], target[q], spanS);
        }
        return x;
    }

    private double[] Values((double A, double B)[] state) => [.. state.Select((s, q) => _responses[q].Value(s))];

    private static double[] Targets(PlannedPoint point)
    {
        var fan = 33.0 * point.MassFlowKgS; // K: fan work warms the inlet air a little, more at higher flow
        var inlet = AmbientK + fan;
        var outlet = RigPhysics.OutletBulkK(inlet, point.MassFlowKgS, point.HeaterPowerW);
        var x = new double[Count];
        x[0] = point.MassFlowKgS;
        x[1] = point.HeaterPowerW;
        x[2] = fan;
        x[3] = outlet - AmbientK;
        for (var w = 0; w < Walls; w++)
        {
            x[4 + w] = RigPhysics.WallK(RigPhysics.WallPositionsM[w], inlet, outlet, point.MassFlowKgS, point.HeaterPowerW) - AmbientK;
        }
        return x;
    }
}

/// <summary>Noise-free values of one instant.</summary>
public sealed record State(double MassFlowKgS, double HeaterPowerW, double InletK, double OutletK, IReadOnlyList<double> WallK);
