using BcPrep.Calibration;

namespace BcPrep.Tools.Scorecard.Coverage;

/// <summary>
/// The scorecard rig's raw logger values (the columns of <see cref="LogWriter"/> after the timestamp: barometer,
/// inlet and outlet transducers, flow meter, cold-junction RTD, six thermocouples, heater voltage and current) and
/// the two ways the coverage scorecard uses them: putting a day's calibration errors onto them, and reading them
/// back through the rig file's calibrations, as `process` does, into SI values. NaN is an empty cell.
/// </summary>
public static class RawSignals
{
    public const int Barometer = 0;
    public const int InletPressure = 1;
    public const int OutletPressure = 2;
    public const int Flow = 3;
    public const int ColdJunction = 4;
    public const int FirstThermocouple = 5;
    public const int Thermocouples = 6;
    public const int HeaterVoltage = 11;
    public const int HeaterCurrent = 12;
    public const int Count = 13;

    /// <summary>The rig file's channel id of each raw value, in the same order.</summary>
    public static readonly string[] ChannelIds =
        ["p_baro", "p_in", "p_out", "mdot", "t_cj", "t_in", "t_out", "t_w1", "t_w2", "t_w3", "t_w4", "heater_v", "heater_i"];

    /// <summary>
    /// A sensor off by its calibration error reads what the perfect one would read for the value plus the error.
    /// Offsets in physical units go through the rig file's gains (barometer 60 hPa/V, transducers 500 Pa/V); the flow
    /// meter reads m(1 + g) + z; the RTD reads R(T + e); a thermocouple adds the emf E(T + e) − E(T) of its deviation at
    /// its own hot-junction temperature (emfs add, temperatures do not); the heater transducers scale by 1 + g.
    /// </summary>
    public static void Apply(CalibrationErrors errors, double[] raw)
    {
        ArgumentNullException.ThrowIfNull(errors);
        ArgumentNullException.ThrowIfNull(raw);
        raw[Barometer] += errors.BarometerPa / 100.0 / 60.0;
        raw[InletPressure] += errors.InletPressurePa / 500.0;
        raw[OutletPressure] += errors.OutletPressurePa / 500.0;
        var massFlow = ((raw[Flow] * 0.003125) - 0.0125) * (1.0 + errors.FlowGain) + errors.FlowZeroKgS;
        raw[Flow] = (massFlow + 0.0125) / 0.003125;
        var junctionK = double.IsNaN(raw[ColdJunction]) ? 297.15 : CallendarVanDusen.TemperatureK(RtdNominal.Pt100, raw[ColdJunction]);
        for (var i = 0; i < Thermocouples; i++)
        {
            var c = FirstThermocouple + i;
            if (double.IsNaN(raw[c]))
            {
                continue;
            }
            var hotK = BcPrep.Calibration.ColdJunction.HotJunctionTemperatureK(ThermocoupleType.K, raw[c] / 1000.0, junctionK);
            var deviationK = errors.ThermocoupleFractions[i] * ToleranceClasses.ThermocoupleHalfWidthK(ThermocoupleType.K, ThermocoupleToleranceClass.Class1, hotK);
            raw[c] += 1000.0 * (Its90Thermocouple.EmfV(ThermocoupleType.K, hotK + deviationK) - Its90Thermocouple.EmfV(ThermocoupleType.K, hotK));
        }
        if (!double.IsNaN(raw[ColdJunction]))
        {
            var deviationK = errors.ColdJunctionFraction * ToleranceClasses.RtdHalfWidthK(RtdToleranceClass.A, RtdElementKind.WireWound, junctionK);
            raw[ColdJunction] = CallendarVanDusen.ResistanceOhm(RtdNominal.Pt100, junctionK + deviationK);
        }
        raw[HeaterVoltage] *= 1.0 + errors.HeaterVoltageGain;
        raw[HeaterCurrent] *= 1.0 + errors.HeaterCurrentGain;
    }

    /// <summary>
    /// SI readings of one raw row through the rig file's calibrations, as `process` converts each sample: the
    /// barometer in Pa absolute, the transducers in Pa gauge, kg/s, the RTD and the thermocouples in K (NIST inverse
    /// polynomial with the same row's cold junction), volts and amperes.
    /// </summary>
    public static double[] Readings(double[] raw)
    {
        ArgumentNullException.ThrowIfNull(raw);
        var si = new double[Count];
        si[Barometer] = ((raw[Barometer] * 60.0) + 800.0) * 100.0;
        si[InletPressure] = raw[InletPressure] * 500.0;
        si[OutletPressure] = raw[OutletPressure] * 500.0;
        si[Flow] = (raw[Flow] * 0.003125) - 0.0125;
        si[ColdJunction] = CallendarVanDusen.TemperatureK(RtdNominal.Pt100, raw[ColdJunction]);
        for (var i = 0; i < Thermocouples; i++)
        {
            var c = FirstThermocouple + i;
            si[c] = BcPrep.Calibration.ColdJunction.HotJunctionTemperatureK(ThermocoupleType.K, raw[c] / 1000.0, si[ColdJunction]);
        }
        si[HeaterVoltage] = raw[HeaterVoltage] * 25.0;
        si[HeaterCurrent] = raw[HeaterCurrent] * 2.5;
        return si;
    }
}
