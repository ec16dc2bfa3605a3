using BcPrep.Rig;

namespace BcPrep.Tests.Rig;

public class UnitTextTests
{
    // Conversion factors: NIST Special Publication 811 (2008), Appendix B.8/B.9. "inch of water, conventional"
    // = 249.0889 Pa and "pound-force per square inch" = 6894.757 Pa are from memory of SP 811; the inch
    // (0.0254 m) and the hectopascal are exact by definition.
    [Theory]
    [InlineData("52.5 mm", Dimension.Length, 0.0525, 1e-15)]
    [InlineData("2 in", Dimension.Length, 0.0508, 1e-15)]
    [InlineData("1.5 um", Dimension.Length, 1.5e-6, 1e-20)]
    [InlineData("2.5 hPa", Dimension.Pressure, 250.0, 1e-12)]
    [InlineData("4 inH2O", Dimension.Pressure, 4 * 249.0889, 0.001)]
    [InlineData("1 psi", Dimension.Pressure, 6894.757, 0.001)]
    [InlineData("20 degC", Dimension.Temperature, 293.15, 1e-12)]
    [InlineData("150 degF", Dimension.Temperature, (150 + 459.67) / 1.8, 1e-9)]
    [InlineData("0.5 K", Dimension.TemperatureDifference, 0.5, 1e-15)]
    [InlineData("9 degF", Dimension.TemperatureDifference, 5.0, 1e-12)]
    [InlineData("72 kg/h", Dimension.MassFlow, 0.02, 1e-12)]
    [InlineData("10 mV", Dimension.Voltage, 0.01, 1e-15)]
    [InlineData("100 ohm", Dimension.Resistance, 100.0, 1e-12)]
    [InlineData("5 min", Dimension.Duration, 300.0, 1e-12)]
    [InlineData("0.25 %", Dimension.Dimensionless, 0.0025, 1e-15)]
    public void Converts_typed_quantities_to_SI_NIST_SP811(string text, Dimension dimension, double expectedSi, double tolerance)
    {
        Assert.True(UnitText.TryToSi(text, dimension, out var si, out var error), error);
        Assert.Equal(expectedSi, si, tolerance);
    }

    [Theory]
    [InlineData("52.5", Dimension.Length, "no unit")]
    [InlineData("52.5 mn", Dimension.Length, "not a unit of length")]
    [InlineData("3 kg/s", Dimension.Pressure, "not a unit of pressure")]
    [InlineData("mm", Dimension.Length, "does not start with a number")]
    [InlineData("2 W", Dimension.TemperatureDifference, "temperature difference")]
    public void Rejects_missing_unknown_or_wrong_dimension_units(string text, Dimension dimension, string fragment)
    {
        Assert.False(UnitText.TryToSi(text, dimension, out _, out var error));
        Assert.Contains(fragment, error, StringComparison.Ordinal);
    }
}
