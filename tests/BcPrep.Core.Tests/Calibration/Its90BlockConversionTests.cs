using BcPrep.Calibration;

namespace BcPrep.Tests.Calibration;

public class Its90BlockConversionTests
{
    // The block conversion must equal the single-value inverse (checked against NIST Monograph 175 tables in
    // Its90ThermocoupleTests) bit for bit, across every inverse piece and its boundaries, with NaN samples mixed in.
    [Theory]
    [InlineData(ThermocoupleType.K)]
    [InlineData(ThermocoupleType.T)]
    [InlineData(ThermocoupleType.J)]
    [InlineData(ThermocoupleType.E)]
    [InlineData(ThermocoupleType.N)]
    public void Block_of_emfs_equals_the_single_value_inverse_bit_for_bit(ThermocoupleType type)
    {
        var range = Its90Thermocouple.InverseRangeV(type);
        var random = new Random((int)type);
        var emf = Enumerable.Range(0, 5003).Select(i => i % 101 == 7 ? double.NaN
            : i < 2000 ? range.Min + ((range.Max - range.Min) * i / 1999.0)   // a sweep: runs that cross piece boundaries
            : range.Min + ((range.Max - range.Min) * random.NextDouble())).ToArray();
        var block = new double[emf.Length];

        Its90Thermocouple.TemperaturesK(type, emf, block);

        for (var i = 0; i < emf.Length; i++)
        {
            var single = Its90Thermocouple.TemperatureK(type, emf[i]);
            Assert.Equal(BitConverter.DoubleToInt64Bits(single), BitConverter.DoubleToInt64Bits(block[i]));
        }
    }

    [Fact]
    public void An_emf_beyond_the_inverse_range_fails_the_block_as_it_fails_alone()
    {
        var max = Its90Thermocouple.InverseRangeV(ThermocoupleType.K).Max;
        double[] emf = [0.001, 0.002, 0.003, max * 1.01, 0.004, 0.005, 0.006, 0.007];

        var error = Assert.Throws<BcPrepDataException>(() => Its90Thermocouple.TemperaturesK(ThermocoupleType.K, emf, new double[emf.Length]));
        Assert.Contains("outside the valid range", error.Message);
    }
}
