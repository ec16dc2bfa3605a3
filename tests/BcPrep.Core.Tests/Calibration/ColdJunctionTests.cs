using BcPrep.Calibration;

namespace BcPrep.Tests.Calibration;

public class ColdJunctionTests
{
    private const double Kelvin = 273.15;

    // Worked checks of domain-reference §1.4 (type K, computed from the NIST Monograph 175 functions), 3 decimals.
    [Theory]
    [InlineData(3.000, 25.0, 97.649, 97.681, 98.576)]
    [InlineData(10.000, 22.0, 267.768, 267.755, 268.222)]
    [InlineData(-1.000, 20.0, -5.122, -5.134, -5.857)]
    public void Type_K_compensation_adds_emfs_and_matches_worked_checks(
        double measuredMv, double referenceC, double viaPolynomialC, double viaExactC, double wrongAddTemperaturesC)
    {
        double polynomial = ColdJunction.HotJunctionTemperatureK(ThermocoupleType.K, measuredMv / 1000.0, referenceC + Kelvin) - Kelvin;
        double exact = ColdJunction.HotJunctionTemperatureK(
            ThermocoupleType.K, measuredMv / 1000.0, referenceC + Kelvin, ThermocoupleInverseMethod.ExactNewton) - Kelvin;

        Assert.InRange(polynomial, viaPolynomialC - 0.0006, viaPolynomialC + 0.0006);
        Assert.InRange(exact, viaExactC - 0.0006, viaExactC + 0.0006);
        Assert.True(Math.Abs(polynomial - wrongAddTemperaturesC) > 0.4, "compensation must not add temperatures");
    }

    [Fact]
    public void Reference_junction_at_zero_Celsius_leaves_emf_unchanged()
    {
        double direct = Its90Thermocouple.TemperatureK(ThermocoupleType.T, 4.279e-3);
        Assert.Equal(direct, ColdJunction.HotJunctionTemperatureK(ThermocoupleType.T, 4.279e-3, Kelvin), 12);
    }

    [Fact]
    public void Sensitivities_are_Seebeck_ratios()
    {
        // Type K Seebeck coefficients 0.04052 mV/°C at 25 °C and 0.04137 at 100 °C (domain-reference §1.4 [CC]).
        double toEmf = ColdJunction.SensitivityToEmfKPerV(ThermocoupleType.K, 100.0 + Kelvin);
        double toReference = ColdJunction.SensitivityToReferenceJunction(ThermocoupleType.K, 100.0 + Kelvin, 25.0 + Kelvin);
        // 0.04137 is printed to 5 decimals: ±0.000005 mV/°C is ±3 K/V here.
        Assert.Equal(1.0 / 0.04137e-3, toEmf, 3.0);
        Assert.Equal(0.04052 / 0.04137, toReference, 3);
    }

    [Fact]
    public void Reference_temperature_outside_direct_range_throws()
    {
        Assert.Throws<BcPrepDataException>(() => ColdJunction.HotJunctionTemperatureK(ThermocoupleType.T, 1e-3, 450.0 + Kelvin));
    }
}
