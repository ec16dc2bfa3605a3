using BcPrep.Tools.SampleDay;

namespace BcPrep.Tools.Scorecard.Coverage;

/// <summary>
/// What a point's written quantities should be, from the generator's noise-free state over the window `process`
/// chose (a 0.5 s grid; the state is smooth, so the grid mean is the sample mean to far below any u).
/// <para><see cref="Physical"/>: the true physical value of each quantity, with no calibration error and no drift:
/// the window means of the true inlet, outlet and wall temperatures, mass flow, heater power and absolute static
/// pressures (barometer plus gauge), and the derived quantities computed from those means with the true geometry
/// (52.5 mm, 5 % loss, 1.20 m heated) and the generator's own air (ideal gas R = 287.05, Sutherland's viscosity,
/// cp = 1007 J/(kg·K)), which are also BcPrep's models, so only the measurement errors separate the two.</para>
/// <para><see cref="TypeA"/>: each channel's window mean had there been no noise, that is the noise-free signal
/// with the day's calibration errors and the pressure zero drift on it, read through the rig's calibrations as
/// `process` reads a sample. The Type A uncertainty covers only the distance of the window mean from this.</para>
/// </summary>
public sealed record CoverageTruth(IReadOnlyDictionary<string, double> Physical, IReadOnlyDictionary<string, double> TypeA)
{
    private const double GridS = 0.5;

    public static CoverageTruth Of(DayRecipe recipe, CalibrationErrors errors, double startS, double endS)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        ArgumentNullException.ThrowIfNull(errors);
        var trajectory = new Trajectory(recipe);
        var drifting = Array.IndexOf(LogWriter.Columns, recipe.DriftingPressureColumn) - 1;
        var steps = Math.Max(1, (int)Math.Floor((endS - startS) / GridS));
        var truths = new double[8 + 4];
        var typeA = new double[RawSignals.Count];
        var raw = new double[RawSignals.Count];
        for (var s = 0; s <= steps; s++)
        {
            var t = startS + ((endS - startS) * s / steps);
            var state = trajectory.At(t);
            LogWriter.Raw(state, t, raw);
            var si = RawSignals.Readings(raw);
            truths[0] += si[RawSignals.Barometer] + si[RawSignals.InletPressure];
            truths[1] += si[RawSignals.Barometer] + si[RawSignals.OutletPressure];
            truths[2] += state.InletK;
            truths[3] += state.OutletK;
            truths[4] += state.MassFlowKgS;
            truths[5] += state.HeaterPowerW;
            for (var w = 0; w < 4; w++)
            {
                truths[8 + w] += state.WallK[w];
            }
            raw[drifting] += recipe.PressureZeroDriftPaPerH * t / 3600.0 / 500.0;
            RawSignals.Apply(errors, raw);
            var read = RawSignals.Readings(raw);
            for (var c = 0; c < RawSignals.Count; c++)
            {
                typeA[c] += read[c];
            }
        }
        var n = steps + 1.0;
        var m = truths.Select(v => v / n).ToArray();
        var physical = Derived(m[0], m[1], m[2], m[3], m[4], m[5], m[8..12]);
        var meansA = new Dictionary<string, double>(StringComparer.Ordinal);
        for (var c = 0; c < RawSignals.Count; c++)
        {
            meansA[RawSignals.ChannelIds[c]] = typeA[c] / n;
        }
        return new CoverageTruth(physical, meansA);
    }

    /// <summary>Every compared quantity from the window means of the true state, by the generator's physics.</summary>
    public static Dictionary<string, double> Derived(double inletPa, double outletPa, double inletK, double outletK, double massFlowKgS,
        double heaterPowerW, IReadOnlyList<double> wallK)
    {
        ArgumentNullException.ThrowIfNull(wallK);
        var absorbedW = heaterPowerW * (1.0 - RigPhysics.HeaterLossFraction);
        var density = RigPhysics.Density(inletPa, inletK);
        var viscosity = RigPhysics.Viscosity(inletK);
        var truth = new Dictionary<string, double>(StringComparer.Ordinal)
        {
            ["inlet.static_pressure"] = inletPa,
            ["outlet.static_pressure"] = outletPa,
            ["pressure_drop.measured"] = inletPa - outletPa,
            ["inlet.temperature"] = inletK,
            ["outlet.temperature"] = outletK,
            ["mass_flow"] = massFlowKgS,
            ["heater_power"] = heaterPowerW,
            ["wall.heat_flux"] = absorbedW / (Math.PI * RigPhysics.DiameterM * RigPhysics.HeatedLengthM),
            ["inlet.density"] = density,
            ["inlet.viscosity"] = viscosity,
            ["inlet.bulk_velocity"] = massFlowKgS / (density * RigPhysics.AreaM2),
            ["reynolds"] = 4.0 * massFlowKgS / (Math.PI * RigPhysics.DiameterM * viscosity),
            ["energy_balance.mismatch"] = (absorbedW - (massFlowKgS * RigPhysics.CpJkgK * (outletK - inletK))) / absorbedW,
        };
        for (var w = 0; w < wallK.Count; w++)
        {
            truth[$"wall.temperature.t_w{w + 1}"] = wallK[w];
        }
        return truth;
    }
}
