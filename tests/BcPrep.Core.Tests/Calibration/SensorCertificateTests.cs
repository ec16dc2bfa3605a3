using BcPrep.Calibration;
using BcPrep.Tests.Pipeline;

namespace BcPrep.Tests.Calibration;

/// <summary>
/// Per-sensor certificate corrections. Worked examples: a calibrated Pt100's own Callendar–Van Dusen coefficients
/// (IEC 60751 equation, reference sheet §2 [CS]; the certificate numbers are invented, the resistances [CC] from the
/// equation); a type K thermocouple's emf offset and deviation function ΔE(t) = E − E_ref(t) (NIST SP 250-35
/// practice, reference sheet §11 [FM]; emfs [CC] from the NIST ITS-90 type K reference function).
/// </summary>
public class SensorCertificateTests
{
    private const double Kelvin = 273.15;
    private static readonly RtdNominal Certified = new(100.015, 3.9090e-3, -5.810e-7, -4.20e-12);

    [Theory]
    [InlineData(157.3513491625, 150.0)]        // R0(1 + A t + B t²), [CC]
    [InlineData(60.254036750000004, -100.0)]  // with C(t − 100)t³ below 0 °C, [CC]
    public void Rtd_with_its_own_coefficients_reads_the_certificate_temperature(double resistanceOhm, double expectedC)
    {
        Assert.Equal(expectedC + Kelvin, CallendarVanDusen.TemperatureK(Certified, resistanceOhm), 1e-9);
        Assert.Equal(resistanceOhm, CallendarVanDusen.ResistanceOhm(Certified, expectedC + Kelvin), 1e-9);
    }

    [Fact]
    public void The_same_resistance_read_with_IEC_coefficients_is_off_by_0_07_K()
    {
        // IEC 60751 nominal coefficients (reference sheet §2) read 157.3513491625 Ω as 150.0702 °C [CC, closed form].
        Assert.Equal(150.07021177009597 + Kelvin, CallendarVanDusen.TemperatureK(RtdNominal.Pt100, 157.3513491625), 1e-9);
    }

    [Fact]
    public void Coefficients_that_do_not_rise_with_temperature_are_refused()
    {
        Assert.Throws<BcPrepDataException>(() => new RtdNominal(100.0, 3.9e-3, -5.0e-6, 0.0));
    }

    [Fact]
    public void Thermocouple_emf_offset_moves_the_temperature_by_offset_over_Seebeck()
    {
        // −12 µV at 300 °C: ΔT = −0.012 mV / S(300 °C), S = 0.04145 mV/°C (reference sheet §1.4 [CC]) → −0.2895 K;
        // the exact root of E_ref(t) = E_ref(300 °C) − 12 µV gives −0.289547 K [CC].
        var certificate = new ThermocoupleCertificate(ThermocoupleCorrectionKind.Emf, -12e-6, [], 4e-6, 2.0, "TC-1");
        Assert.Equal(-0.289547, certificate.CorrectionK(ThermocoupleType.K, 300.0 + Kelvin, 25.0 + Kelvin), 1e-5);
        // Its uncertainty U/k = 2 µV as a temperature: 2 µV / S(300 °C) = 0.04826 K.
        Assert.Equal(0.002 / 0.041445717968713325, certificate.StandardUncertaintyK(ThermocoupleType.K, 300.0 + Kelvin), 1e-6);
    }

    [Fact]
    public void Thermocouple_deviation_function_is_solved_with_the_reference_junction_term()
    {
        // ΔE(t) = 0.05 t + 5e-5 t² µV (t in °C), junction at 25 °C, true 300 °C: the loop reads
        // E_ref(300) + ΔE(300) − ΔE(25) = 12.22678428 mV, which the reference function alone puts at 300.43955 °C [CC].
        var certificate = new ThermocoupleCertificate(ThermocoupleCorrectionKind.Deviation, 0.0, [0.0, 0.05e-6, 5e-11], 2e-6, 2.0, "TC-2");
        var referenceK = Its90Thermocouple.TemperatureK(ThermocoupleType.K, 12.226784279996956e-3, ThermocoupleInverseMethod.ExactNewton);
        Assert.Equal(300.4395542762153 + Kelvin, referenceK, 1e-6);
        Assert.Equal(300.0 + Kelvin, referenceK + certificate.CorrectionK(ThermocoupleType.K, referenceK, 25.0 + Kelvin), 1e-8);
    }

    [Fact]
    public void Temperature_offset_from_the_rig_file_shifts_the_inlet_temperature_and_enters_the_budget()
    {
        // Type K at 0 °C reference, 21 °C: the rig's correction of +0.30 K (U = 0.10 K, k = 2 → u = 0.05 K) moves the
        // inlet temperature by 0.30 K against the same sensor without it. Worked example: the certificate's own numbers.
        var emfMv = Its90Thermocouple.EmfV(ThermocoupleType.K, 294.15) * 1000.0;
        double Inlet(string correction, out double u)
        {
            using var day = BoundaryPhysicsTests.Duct(withInletTemperature: false)
                .Channel("t_in", "measures = \"bulk_temperature\"\nplane = \"inlet\"\nsensor = \"thermocouple\"\ntype = \"K\"\nraw_unit = \"mV\"\ncold_junction_temperature = \"0 degC\"\n" + correction, emfMv, 0.0005)
                .Channel("m_dot", SyntheticDay.Direct("mass_flow", "kg/s"), 0.02, 0.00001);
            var t = day.Process().Points.Single().Output("inlet.temperature")!;
            u = t.Budget.SingleOrDefault(b => b.InputName == "t_in: certificate correction (TC-9)")?.StandardUncertainty ?? double.NaN;
            return t.Estimate;
        }

        var plain = Inlet("", out _);
        var corrected = Inlet("correction = { temperature = \"0.30 K\", expanded = \"0.10 K\", k = 2, certificate = \"TC-9\" }", out var uCorrection);
        Assert.Equal(0.30, corrected - plain, 1e-9);
        Assert.Equal(0.05, uCorrection, 1e-12);
    }
    [Fact]
    public void Rig_keys_are_read_and_an_incomplete_certificate_is_refused_naming_the_key()
    {
        const string rtd = """
            [[channel]]
            id = "t_cj"
            measures = "cold_junction_temperature"
            sensor = "rtd"
            r0 = "100.015 ohm"
            coefficients = { a = 3.9090e-3, b = -5.810e-7, c = -4.2e-12, expanded = "0.03 K", k = 2, certificate = "PRT-5" }

            """;
        var rig = BcPrep.Rig.RigLoader.Load(SyntheticDay.Header + rtd, "rig.toml");
        var sensor = Assert.IsType<BcPrep.Rig.RtdSensor>(rig.Channel("t_cj")!.Sensor);
        Assert.Equal(Certified, sensor.Nominal);
        Assert.Equal(0.03, sensor.Certificate!.ExpandedUncertaintyK, 1e-12);

        var failure = Assert.Throws<BcPrepFailure>(() => BcPrep.Rig.RigLoader.Load(SyntheticDay.Header + rtd.Replace("expanded = \"0.03 K\", ", "", StringComparison.Ordinal) + """
            [[channel]]
            id = "t_in"
            measures = "bulk_temperature"
            plane = "inlet"
            sensor = "thermocouple"
            cold_junction = "t_cj"
            correction = { emf = "-12 uV", temperature = "0.3 K", expanded = "4 uV" }
            """, "rig.toml"));
        Assert.Contains(failure.Problems, p => p.Location.Key!.EndsWith("coefficients.expanded", StringComparison.Ordinal));
        Assert.Contains(failure.Problems, p => p.Location.Key!.EndsWith("correction.temperature", StringComparison.Ordinal) && p.Message.Contains("exactly one", StringComparison.Ordinal));
    }
}
