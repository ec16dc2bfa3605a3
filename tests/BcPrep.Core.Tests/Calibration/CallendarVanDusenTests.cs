using BcPrep.Calibration;

namespace BcPrep.Tests.Calibration;

public class CallendarVanDusenTests
{
    private const double Kelvin = 273.15;

    // IEC 60751 Pt100 values (domain-reference §2; −100 … 800 °C also as BS EN 60751:2008 segment bounds,
    // −200 and 850 °C as published range ends), 4 decimals.
    [Theory]
    [InlineData(-200.0, 18.5201)]
    [InlineData(-100.0, 60.2558)]
    [InlineData(-50.0, 80.3063)]
    [InlineData(0.0, 100.0000)]
    [InlineData(25.0, 109.7347)]
    [InlineData(50.0, 119.3971)]
    [InlineData(100.0, 138.5055)]
    [InlineData(150.0, 157.3251)]
    [InlineData(200.0, 175.8560)]
    [InlineData(300.0, 212.0515)]
    [InlineData(400.0, 247.0920)]
    [InlineData(500.0, 280.9775)]
    [InlineData(600.0, 313.7080)]
    [InlineData(850.0, 390.4811)]
    public void Pt100_table_both_directions(double tC, double resistanceOhm)
    {
        Assert.InRange(CallendarVanDusen.ResistanceOhm(RtdNominal.Pt100, tC + Kelvin), resistanceOhm - 1e-4, resistanceOhm + 1e-4);

        // 1e-4 ohm at >= 0.18 ohm/K is below 6e-4 K.
        double t = CallendarVanDusen.TemperatureK(RtdNominal.Pt100, resistanceOhm) - Kelvin;
        Assert.InRange(t, tC - 6e-4, tC + 6e-4);

        // Pt1000 is the same curve scaled by ten.
        Assert.InRange(CallendarVanDusen.ResistanceOhm(RtdNominal.Pt1000, tC + Kelvin), (10 * resistanceOhm) - 1e-3, (10 * resistanceOhm) + 1e-3);
    }

    [Fact]
    public void Alpha_is_0_00385()
    {
        // IEC 60751: α = (R100 − R0)/(100 R0) = 0.003851 (to 4 significant digits).
        double r100 = CallendarVanDusen.ResistanceOhm(RtdNominal.Pt100, 100.0 + Kelvin);
        Assert.Equal(0.003851, (r100 - 100.0) / (100.0 * 100.0), 6);
    }

    [Fact]
    public void Slope_is_the_derivative_of_resistance()
    {
        for (double tC = -199.0; tC < 849.0; tC += 3.7)
        {
            double tK = tC + Kelvin;
            double numeric = (CallendarVanDusen.ResistanceOhm(RtdNominal.Pt100, tK + 1e-4) - CallendarVanDusen.ResistanceOhm(RtdNominal.Pt100, tK - 1e-4)) / 2e-4;
            Assert.Equal(numeric, CallendarVanDusen.SlopeOhmPerK(RtdNominal.Pt100, tK), 1e-7);
        }
    }

    [Theory]
    [InlineData(-200.5)]
    [InlineData(850.5)]
    public void Temperature_outside_minus200_to_850_throws(double tC)
    {
        Assert.Throws<BcPrepDataException>(() => CallendarVanDusen.ResistanceOhm(RtdNominal.Pt100, tC + Kelvin));
    }

    [Theory]
    [InlineData(18.5)]
    [InlineData(390.6)]
    [InlineData(-5.0)]
    public void Resistance_outside_range_throws_naming_value(double resistanceOhm)
    {
        var ex = Assert.Throws<BcPrepDataException>(() => CallendarVanDusen.TemperatureK(RtdNominal.Pt100, resistanceOhm));
        Assert.Contains(resistanceOhm.ToString("R", System.Globalization.CultureInfo.InvariantCulture), ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Nonpositive_nominal_is_rejected()
    {
        Assert.Throws<BcPrepDataException>(() => new RtdNominal(0.0));
        Assert.Throws<BcPrepDataException>(() => CallendarVanDusen.ResistanceOhm(default, 300.0));
    }
}
