using BcPrep.Calibration;

namespace BcPrep.Tests.Calibration;

public class CallendarVanDusenBlockTests
{
    // The block inverse must equal the single-value one (checked against IEC 60751 tables in CallendarVanDusenTests) bit
    // for bit: a sweep over the whole resistance span (vectors below 0 °C, across R0 and above it), random values, NaN
    // samples, the nominal coefficients and a calibrated sensor's own, and the output written over the input.
    // Catches a vector root with its operations in another order, and a vector below 0 °C taken by the closed form.
    [Theory]
    [InlineData(100.0, CallendarVanDusen.A, CallendarVanDusen.B, CallendarVanDusen.C)]
    [InlineData(1000.0, 3.9092e-3, -5.89e-7, -4.1e-12)] // a calibrated Pt1000 (made-up certificate values)
    public void Block_of_resistances_equals_the_single_value_inverse_bit_for_bit(double r0, double a, double b, double c)
    {
        var nominal = new RtdNominal(r0, a, b, c);
        var range = CallendarVanDusen.ResistanceRangeOhm(nominal);
        var random = new Random(7);
        var ohm = Enumerable.Range(0, 4003).Select(i => i % 89 == 3 ? double.NaN
            : i < 2000 ? range.Min + ((range.Max - range.Min) * i / 1999.0)
            : r0 * (0.98 + (0.05 * random.NextDouble()))).ToArray();
        var block = new double[ohm.Length];

        CallendarVanDusen.TemperaturesK(nominal, ohm, block);
        var inPlace = (double[])ohm.Clone();
        CallendarVanDusen.TemperaturesK(nominal, inPlace, inPlace);

        for (var i = 0; i < ohm.Length; i++)
        {
            var single = BitConverter.DoubleToInt64Bits(CallendarVanDusen.TemperatureK(nominal, ohm[i]));
            Assert.Equal(single, BitConverter.DoubleToInt64Bits(block[i]));
            Assert.Equal(single, BitConverter.DoubleToInt64Bits(inPlace[i]));
        }
    }

    [Fact]
    public void A_resistance_beyond_the_range_fails_the_block_as_it_fails_alone()
    {
        // IEC 60751: a Pt100 reads 390.48 Ω at 850 °C, the top of the range.
        double[] ohm = [100.0, 101.0, 102.0, 103.0, 104.0, 395.0, 105.0, 106.0];

        var error = Assert.Throws<BcPrepDataException>(() => CallendarVanDusen.TemperaturesK(new RtdNominal(100.0), ohm, new double[ohm.Length]));
        Assert.Contains("outside the valid range", error.Message);
    }
}
