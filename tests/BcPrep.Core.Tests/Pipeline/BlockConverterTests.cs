using BcPrep.Pipeline;
using BcPrep.Rig;

namespace BcPrep.Tests.Pipeline;

public class BlockConverterTests
{
    private static readonly RigDescription Rig = RigLoader.Load(File.ReadAllText(Tests.Rig.RigLoaderTests.SampleRigPath), "rig.toml");

    // The block path must give exactly what the per-sample conversion gives (which the calibration tests check against
    // NIST ITS-90 and IEC 60751); linear channels take the vector path, the others the per-sample one.
    [Theory]
    [InlineData("p_baro", 2.0, 4.0)]
    [InlineData("p_out", -0.1, 0.5)]
    [InlineData("mdot", 4.0, 20.0)]
    [InlineData("heater_v", 0.0, 5.0)]
    [InlineData("t_cj", 105.0, 115.0)]
    [InlineData("t_cj", 95.0, 104.0)] // an RTD across 0 °C (R0 = 100 Ω): the quartic's Newton below, the closed form above
    [InlineData("t_in", -0.5, 2.0)]
    public void Block_conversion_equals_the_per_sample_conversion_bit_for_bit(string channelId, double rawLow, double rawHigh)
    {
        var channel = Rig.Channel(channelId)!;
        var converter = BlockConverter.For(channel);
        var random = new Random(channelId.Length);
        var raw = Enumerable.Range(0, 1003).Select(i => i % 97 == 5 ? double.NaN : rawLow + ((rawHigh - rawLow) * random.NextDouble())).ToArray();
        var reference = Enumerable.Range(0, raw.Length).Select(_ => 0.001 * random.NextDouble()).ToArray();
        var si = new double[raw.Length];

        converter.Convert(raw, reference, 0.0, si);

        for (var i = 0; i < raw.Length; i++)
        {
            var expected = double.IsNaN(raw[i]) ? double.NaN : converter.PerSample(raw[i], reference[i]);
            Assert.Equal(BitConverter.DoubleToInt64Bits(expected), BitConverter.DoubleToInt64Bits(si[i]));
        }

        // Without a junction channel: the fixed reference emf for every sample.
        converter.Convert(raw, default, 0.0007, si);
        for (var i = 0; i < raw.Length; i++)
        {
            var expected = double.IsNaN(raw[i]) ? double.NaN : converter.PerSample(raw[i], 0.0007);
            Assert.Equal(BitConverter.DoubleToInt64Bits(expected), BitConverter.DoubleToInt64Bits(si[i]));
        }
    }

    [Fact]
    public void A_sample_outside_the_calibration_range_fails_the_block()
    {
        // IEC 60751: 400 Ω is beyond a Pt100's 390.48 Ω at 850 °C.
        var rtd = BlockConverter.For(Rig.Channel("t_cj")!);
        double[] ohm = [108.0, 109.0, 110.0, 111.0, 400.0, 112.0, 113.0, 114.0];
        Assert.Throws<BcPrepDataException>(() => rtd.Convert(ohm, default, 0.0, new double[ohm.Length]));

        var converter = BlockConverter.For(Rig.Channel("t_in")!);
        double[] raw = [0.1, 0.2, 90.0, 0.3]; // 90 mV is beyond type K's inverse range (NIST Monograph 175: 54.886 mV at 1372 °C)

        Assert.Throws<BcPrepDataException>(() => converter.Convert(raw, new double[raw.Length], 0.0, new double[raw.Length]));
    }
}
