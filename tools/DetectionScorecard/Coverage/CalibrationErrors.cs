namespace BcPrep.Tools.Scorecard.Coverage;

/// <summary>
/// One realisation of the scorecard rig's calibration errors, drawn from the distributions its rig file states
/// (<see cref="RigText"/>): every sensor of a generated day is one instrument off its nominal calibration by an
/// amount its certificate or data sheet only bounds. The errors are fixed for the day (a zero offset, a gain error,
/// a tolerance-class deviation), so they do not average out over a window, which is why they are Type B.
/// Pressures in Pa, temperatures in K, gains as fractions.
/// </summary>
/// <param name="BarometerPa">Barometer offset: certificate 0.30 hPa expanded with k = 2, normal (u = 15 Pa).</param>
/// <param name="InletPressurePa">Inlet transducer zero: 0.25 % of 5 kPa, rectangular (half-width 12.5 Pa).</param>
/// <param name="OutletPressurePa">Outlet transducer zero: as the inlet one.</param>
/// <param name="FlowGain">Flow meter: 1.0 % of reading, rectangular.</param>
/// <param name="FlowZeroKgS">Flow meter: 0.1 % of 0.05 kg/s span, rectangular.</param>
/// <param name="ColdJunctionFraction">RTD class A deviation as a fraction of its half-width 0.15 K + 0.002·|t| (IEC 60751), rectangular.</param>
/// <param name="ThermocoupleFractions">Thermocouple class 1 deviation as a fraction of its half-width (IEC 60584-1), rectangular;
/// order t_in, t_out, t_w1…t_w4.</param>
/// <param name="HeaterVoltageGain">Heater voltage transducer: 0.5 % of reading, rectangular.</param>
/// <param name="HeaterCurrentGain">Heater current transducer: 0.5 % of reading, rectangular.</param>
/// <param name="DiameterErrorM">Stated minus true inner diameter: standard uncertainty 0.05 mm, normal (the rig loader's reading).</param>
/// <param name="LossFractionError">Stated minus true heater loss fraction: u = 2 %, rectangular as the point model takes it.</param>
public sealed record CalibrationErrors(
    double BarometerPa,
    double InletPressurePa,
    double OutletPressurePa,
    double FlowGain,
    double FlowZeroKgS,
    double ColdJunctionFraction,
    IReadOnlyList<double> ThermocoupleFractions,
    double HeaterVoltageGain,
    double HeaterCurrentGain,
    double DiameterErrorM,
    double LossFractionError)
{
    /// <summary>No error at all: the logs as the generator writes them.</summary>
    public static CalibrationErrors None { get; } = new(0, 0, 0, 0, 0, 0, [0, 0, 0, 0, 0, 0], 0, 0, 0, 0);

    /// <summary>Draws one realisation. Rectangular terms are U(−a, a) with the half-width a the rig file gives.</summary>
    public static CalibrationErrors Draw(Random random)
    {
        ArgumentNullException.ThrowIfNull(random);
        return new CalibrationErrors(
            BarometerPa: 15.0 * Gaussian(random),
            InletPressurePa: Symmetric(random, 0.0025 * 5000.0),
            OutletPressurePa: Symmetric(random, 0.0025 * 5000.0),
            FlowGain: Symmetric(random, 0.01),
            FlowZeroKgS: Symmetric(random, 0.001 * 0.05),
            ColdJunctionFraction: Symmetric(random, 1.0),
            ThermocoupleFractions: [.. Enumerable.Range(0, 6).Select(_ => Symmetric(random, 1.0))],
            HeaterVoltageGain: Symmetric(random, 0.005),
            HeaterCurrentGain: Symmetric(random, 0.005),
            DiameterErrorM: 0.05e-3 * Gaussian(random),
            LossFractionError: Symmetric(random, Math.Sqrt(3.0) * 0.02));
    }

    /// <summary>The inner diameter the rig file states (m): the true 52.5 mm plus its error.</summary>
    public double StatedDiameterM => SampleDay.RigPhysics.DiameterM + DiameterErrorM;

    /// <summary>The heater loss fraction the rig file states: the true 5 % plus its error.</summary>
    public double StatedLossFraction => SampleDay.RigPhysics.HeaterLossFraction + LossFractionError;

    private static double Symmetric(Random random, double halfWidth) => halfWidth * ((2.0 * random.NextDouble()) - 1.0);

    /// <summary>Standard normal by Box–Muller (two uniforms, one normal kept).</summary>
    public static double Gaussian(Random random)
    {
        var u1 = 1.0 - random.NextDouble();
        var u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }
}
