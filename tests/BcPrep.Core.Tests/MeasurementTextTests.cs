using System.Globalization;

namespace BcPrep.Tests;

/// <summary>
/// Rounding of value ± U for a person (JCGM 100:2008 7.2.6: U to at most two significant digits, the value to the
/// same decimal place). The grouping separator is U+202F (narrow no-break space); it is written '_' in the
/// expectations below for readability.
/// </summary>
public sealed class MeasurementTextTests
{
    [Theory]
    // The examples: 26655.4 ± 4E+02 and 7.90006 ± 0.11 as the report showed them (JCGM 100 7.2.6).
    [InlineData(26655.4, 398.0, "26_660 ± 400")]
    [InlineData(7.90006, 0.11, "7.90 ± 0.11")]
    // JCGM 100 7.2.2's example, m_S = (100.021 47 ± 0.000 35) g: kept whole, the integer part needs no grouping.
    [InlineData(100.02147, 0.00035, "100.02147 ± 0.00035")]
    // Rounding U carries it to a new digit (0.0996 → 0.10): the value follows to the new place.
    [InlineData(12.3456, 0.0996, "12.35 ± 0.10")]
    // A tie rounds away from zero (common practice): 0.125 to two decimals.
    [InlineData(0.125, 0.013, "0.125 ± 0.013")]
    [InlineData(2.345, 0.011, "2.345 ± 0.011")]
    [InlineData(2.3455, 0.011, "2.346 ± 0.011")]
    // Negative values keep their sign; one that rounds to zero is 0, never -0.
    [InlineData(-12.3456, 0.011, "-12.346 ± 0.011")]
    [InlineData(-101325.4, 17.0, "-101_325 ± 17")]
    [InlineData(-4.6, 120.0, "0 ± 120")]
    // U larger than the value: the value is rounded to U's place, which may leave nothing of it.
    [InlineData(0.3, 12.3, "0 ± 12")]
    [InlineData(35.0, 120.0, "40 ± 120")]
    // Large but ordinary: nine integer digits stay plain, grouped in threes (SI Brochure 5.4.4).
    [InlineData(123456789.4, 12.0, "123_456_789 ± 12")]
    // Very large: a power of ten, a multiple of three.
    [InlineData(6.02214076e23, 3.0e17, "(602.21408 ± 0.00030) × 10²¹")]
    // Small but ordinary: six decimals stay plain (the report's 0.00253391).
    [InlineData(0.00253391, 0.000011, "0.002534 ± 0.000011")]
    // Very small: a power of ten.
    [InlineData(2.5339e-9, 1.1e-11, "(2.534 ± 0.011) × 10⁻⁹")]
    [InlineData(-2.5339e-9, 1.1e-11, "(-2.534 ± 0.011) × 10⁻⁹")]
    public void Value_and_uncertainty_are_rounded_to_the_uncertainty(double value, double uncertainty, string expected)
    {
        Assert.Equal(expected, Readable(MeasurementText.WithUncertainty(value, uncertainty)));
    }

    [Theory]
    // U = 0 (an exact value) says nothing about the decimal place: six significant digits, then ± 0.
    [InlineData(101325.0, 0.0, "101_325 ± 0")]
    [InlineData(0.0, 0.0, "0 ± 0")]
    [InlineData(1.0 / 3.0, 0.0, "0.333333 ± 0")]
    // A missing U gives the value alone; a missing value a dash.
    [InlineData(1.0 / 3.0, double.NaN, "0.333333")]
    [InlineData(double.NaN, 0.1, "–")]
    [InlineData(double.PositiveInfinity, 0.1, "–")]
    public void Edge_cases_of_value_and_uncertainty(double value, double uncertainty, string expected)
    {
        Assert.Equal(expected, Readable(MeasurementText.WithUncertainty(value, uncertainty)));
    }

    [Theory]
    [InlineData(0.00253391, 4, "0.002534")]
    // Seven decimals would be needed: a power of ten instead (the detector's slope uncertainties).
    [InlineData(7.18e-05, 3, "7.18 × 10⁻⁵")]
    [InlineData(7.18e-04, 3, "0.000718")]
    [InlineData(0.001333333, 4, "0.001333")]
    [InlineData(9.9996, 4, "10")]
    [InlineData(1234567.0, 4, "1_235_000")]
    [InlineData(-0.5, 4, "-0.5")]
    [InlineData(0.0, 4, "0")]
    [InlineData(3.3e-9, 3, "3.3 × 10⁻⁹")]
    [InlineData(4.2e12, 3, "4.2 × 10¹²")]
    public void A_number_without_uncertainty_has_the_significant_digits_asked_and_no_e_notation(double value, int digits, string expected)
    {
        Assert.Equal(expected, Readable(MeasurementText.Number(value, digits)));
    }

    [Fact]
    public void A_number_for_a_message_about_a_typed_value_can_stay_ungrouped()
    {
        Assert.Equal("10000", MeasurementText.Number(10000, 6, grouped: false));
        Assert.Equal("2 × 10⁻⁶", MeasurementText.Number(2e-6, 6, grouped: false));
    }

    [Fact]
    public void The_text_does_not_depend_on_the_culture()
    {
        var previous = CultureInfo.CurrentCulture;
        try
        {
            var comma = (CultureInfo)CultureInfo.InvariantCulture.Clone();
            comma.NumberFormat.NumberDecimalSeparator = ",";
            comma.NumberFormat.NumberGroupSeparator = ".";
            CultureInfo.CurrentCulture = comma;
            Assert.Equal("26_660.4 ± 1.2", Readable(MeasurementText.WithUncertainty(26660.4321, 1.23)));
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
        }
    }

    [Fact]
    public void Rounded_gives_the_two_texts_and_their_power_of_ten()
    {
        Assert.Equal(("7.90", "0.11", 0), MeasurementText.Rounded(7.90006, 0.11));
        Assert.Equal(("2.534", "0.011", -9), MeasurementText.Rounded(2.5339e-9, 1.1e-11));
        Assert.Throws<ArgumentOutOfRangeException>(() => MeasurementText.Rounded(1.0, 0.0));
    }

    private static string Readable(string text) => text.Replace(MeasurementText.GroupSeparator, "_", StringComparison.Ordinal);
}
