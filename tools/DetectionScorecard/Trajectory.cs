using BcPrep.Tools.SampleDay;

namespace BcPrep.Tools.Scorecard;

/// <summary>
/// The noise-free state of a generated day: every quantity is a first-order lag toward the target of the point in
/// force, so within a point x(t) = T + (x(S) − T)·exp(−(t − S)/τ), exact at any sample rate. Temperatures are
/// ambient plus a rise; ambient drifts linearly.
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
    private readonly double[] _tau;
    private readonly double[][] _targets;
    private readonly double[][] _startStates;

    public Trajectory(DayRecipe recipe)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        _recipe = recipe;
        _tau = [recipe.FlowTauS, 2.0, recipe.InletTauS, recipe.OutletTauS, .. recipe.WallTauS];
        _targets = recipe.Points.Select(Targets).ToArray();
        _startStates = new double[recipe.Points.Count][];
        for (var k = 0; k < recipe.Points.Count; k++)
        {
            if (k == 0)
            {
                _startStates[0] = recipe.StartsSettled && recipe.Points[0].StartS == 0 ? (double[])_targets[0].Clone() : new double[Count];
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
        var x = k < 0 ? new double[Count] : Advance(_startStates[k], _targets[k], timeS - _recipe.Points[k].StartS);
        var ambient = AmbientK + (_recipe.AmbientDriftKPerH * timeS / 3600.0);
        return new State(x[0], x[1], ambient + x[2], ambient + x[3], [.. x.Skip(4).Select(r => ambient + r)]);
    }

    /// <summary>
    /// Seconds after point <paramref name="index"/>'s step until the flow, the outlet and every wall are within their
    /// tolerance (<see cref="DayTruth"/>) of the point's targets: τ·ln(|departure| / tolerance), the largest.
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
            var tolerance = q == 0 ? DayTruth.FlowToleranceKgS(target[0]) : DayTruth.TemperatureToleranceK(AmbientK + target[q]);
            var departure = Math.Abs(start[q] - target[q]);
            if (departure > tolerance)
            {
                span = Math.Max(span, trajectory._tau[q] * Math.Log(departure / tolerance));
            }
        }
        return span;
    }

    /// <summary>The key quantities of the truth: mass flow, outlet bulk temperature and every wall thermocouple.</summary>
    private static readonly int[] KeyQuantities = [0, 3, 4, 5, 6, 7];

    private double[] Advance(double[] from, double[] target, double spanS)
    {
        var x = new double[Count];
        for (var q = 0; q < Count; q++)
        {
            x[q] = target[q] + ((from[q] - target[q]) * Math.Exp(-spanS / _tau[q]));
        }
        return x;
    }

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
