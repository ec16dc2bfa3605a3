using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class SectionwiseGustafssonTests
{
    // Reference: scipy.signal.filtfilt(b, a, x, method='gust') with b, a = butter(2, 0.2) on
    // x[n] = sin(2π·0.02n) + 0.5·sin(2π·0.3n), n = 0..49 (domain reference sheet §6.2). A single biquad is one
    // section, so the section-by-section chain must reproduce scipy's edges exactly.
    [Fact]
    public void One_section_reproduces_the_scipy_gust_edges()
    {
        var x = Enumerable.Range(0, 50).Select(n => Math.Sin(2 * Math.PI * 0.02 * n) + (0.5 * Math.Sin(2 * Math.PI * 0.3 * n))).ToArray();
        var filter = ButterworthDesign.LowPass(2, 0.1, 1.0); // f_c/f_s = 0.1 is scipy's Wn = 0.2

        ChannelConditioner.FilterZeroPhase(filter.Sections, x);

        Assert.Equal(0.1956536924, x[0], 9);
        Assert.Equal(0.2284612777, x[1], 9);
        Assert.Equal(0.2830564342, x[2], 9);
        Assert.Equal(0.1266293216, x[24], 9);
        Assert.Equal(-0.3854948513, x[47], 9);
        Assert.Equal(-0.3273495919, x[48], 9);
        Assert.Equal(-0.3023763438, x[49], 9);
    }

    [Fact]
    public void A_cascade_has_the_squared_gain_of_all_its_sections_in_the_interior()
    {
        // Analytic check: zero-phase filtering of a long sinusoid scales it by ∏|Hᵢ(f)|² with no phase shift.
        const double fs = 1000.0;
        var filter = ButterworthDesign.LowPass(4, 20.0, fs);
        var f = 25.0;
        var x = Enumerable.Range(0, 20_000).Select(n => Math.Sin(2 * Math.PI * f * n / fs)).ToArray();
        var gain = Math.Pow(filter.Magnitude(f, fs), 2);

        ChannelConditioner.FilterZeroPhase(filter.Sections, x);

        for (var n = 8000; n < 12_000; n += 97)
        {
            Assert.Equal(gain * Math.Sin(2 * Math.PI * f * n / fs), x[n], 9);
        }
    }
}
