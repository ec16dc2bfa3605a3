namespace BcPrep.Tools.Scorecard;

/// <summary>
/// The true steady window of one point: from the moment every key quantity (mass flow, outlet bulk temperature,
/// every wall thermocouple, so the slowest one decides) stays within its tolerance of its settled value (its
/// noise-free value just before the next step), to the next step.
/// </summary>
public sealed record TrueWindow(int Index, double StepS, double SettledS, double EndS)
{
    public double SteadyS => EndS - SettledS;
}

/// <summary>The truth of a generated day and the tolerances it is judged with.</summary>
public sealed record DayTruth(IReadOnlyList<TrueWindow> Windows)
{
    /// <summary>
    /// A fifth of the mass flow's declared standard uncertainty: 1 % of reading and 0.1 % of 0.05 kg/s, both
    /// rectangular limits (the rig file's flow meter terms).
    /// </summary>
    public static double FlowToleranceKgS(double massFlowKgS) =>
        Math.Sqrt((Math.Pow(0.01 * massFlowKgS, 2) + Math.Pow(0.001 * 0.05, 2)) / 3.0) / 5.0;

    /// <summary>
    /// A fifth of a class 1 thermocouple's standard uncertainty: IEC 60584-1 class 1 is ±1.5 K or ±0.004·|t|
    /// (the larger) from −40 to 1000 °C, a rectangular limit, so u = limit/√3.
    /// </summary>
    public static double TemperatureToleranceK(double temperatureK) =>
        Math.Max(1.5, 0.004 * Math.Abs(temperatureK - 273.15)) / Math.Sqrt(3.0) / 5.0;

    public static DayTruth Of(DayRecipe recipe)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        var trajectory = new Trajectory(recipe);
        var windows = new List<TrueWindow>();
        for (var i = 0; i < recipe.Points.Count; i++)
        {
            var step = recipe.Points[i].StartS;
            var end = i + 1 < recipe.Points.Count ? recipe.Points[i + 1].StartS : recipe.DurationS;
            var settledValue = trajectory.At(end - 1e-6);
            var t = end;
            const double stepS = 0.5;
            while (t - stepS >= step && Within(trajectory.At(t - stepS), settledValue))
            {
                t -= stepS;
            }
            windows.Add(new TrueWindow(i, step, t, end));
        }
        return new DayTruth(windows);
    }

    private static bool Within(State x, State settled)
    {
        if (Math.Abs(x.MassFlowKgS - settled.MassFlowKgS) > FlowToleranceKgS(settled.MassFlowKgS))
        {
            return false;
        }
        if (Math.Abs(x.OutletK - settled.OutletK) > TemperatureToleranceK(settled.OutletK))
        {
            return false;
        }
        for (var w = 0; w < x.WallK.Count; w++)
        {
            if (Math.Abs(x.WallK[w] - settled.WallK[w]) > TemperatureToleranceK(settled.WallK[w]))
            {
                return false;
            }
        }
        return true;
    }
}
