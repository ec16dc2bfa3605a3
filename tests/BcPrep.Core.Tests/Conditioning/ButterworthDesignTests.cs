using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class ButterworthDesignTests
{
    // Reference coefficient sets: scipy.signal.butter(N, Wn) with Wn = f_c/(f_s/2) (domain reference 6.1;
    // butter(2,0.2) and butter(4,0.1) also confirmed by independent published copies). Here f_s = 2 so f_c = Wn.
    public static TheoryData<int, double, double[], double[]> ScipyButter => new()
    {
        { 2, 0.2, [0.0674552738890719, 0.134910547778144, 0.0674552738890719], [1, -1.14298050253990, 0.412801598096189] },
        { 4, 0.1, [0.000416599204, 0.001666396818, 0.002499595226, 0.001666396818, 0.000416599204],
            [1, -3.180638548875, 3.861194348994, -2.112155355111, 0.438265142262] },
        { 2, 0.1, [0.020083365564, 0.040166731128, 0.020083365564], [1, -1.561018075801, 0.641351538058] },
        { 4, 0.2, [0.004824343358, 0.019297373431, 0.028946060146, 0.019297373431, 0.004824343358],
            [1, -2.369513007182, 2.313988414416, -1.054665405879, 0.187379492368] },
        { 2, 0.5, [0.292893218813, 0.585786437627, 0.292893218813], [1, 0, 0.171572875254] },
    };

    [Theory]
    [MemberData(nameof(ScipyButter))]
    public void Transfer_function_matches_scipy_butter_to_1e10(int order, double wn, double[] b, double[] a)
    {
        var filter = ButterworthDesign.LowPass(order, cutoffHz: wn, sampleRateHz: 2.0);

        Assert.Equal(b.Length, filter.B.Count);
        Assert.Equal(a.Length, filter.A.Count);
        for (int i = 0; i < b.Length; i++)
        {
            Assert.Equal(b[i], filter.B[i], 1e-10);
            Assert.Equal(a[i], filter.A[i], 1e-10);
        }
    }

    [Fact]
    public void Cutoff_in_hertz_uses_fraction_of_nyquist_like_scipy()
    {
        // butter(4, 0.1) == 4th order, 50 Hz at 1000 Hz (Wn = 50/500).
        var filter = ButterworthDesign.LowPass(4, 50.0, 1000.0);
        Assert.Equal(0.438265142262, filter.A[4], 1e-10);
    }

    [Fact]
    public void Sections_of_order4_match_scipy_sos_and_multiply_back_to_tf()
    {
        // scipy.signal.butter(4, 0.1, output='sos') [domain reference 6.1, CC].
        var filter = ButterworthDesign.LowPass(4, 0.1, 2.0);
        Assert.Equal(2, filter.Sections.Count);
        var s0 = filter.Sections[0];
        var s1 = filter.Sections[1];
        Assert.Equal(4.165992044066e-04, s0.B0, 1e-14);
        Assert.Equal(8.331984088132e-04, s0.B1, 1e-14);
        Assert.Equal(-1.479674216931, s0.A1, 1e-11);
        Assert.Equal(0.5558215432825, s0.A2, 1e-11);
        Assert.Equal(2.0, s1.B1, 1e-15);
        Assert.Equal(-1.700964331944, s1.A1, 1e-11);
        Assert.Equal(0.7884997398153, s1.A2, 1e-11);

        var rebuilt = IirFilter.FromSections(filter.Sections);
        for (int i = 0; i < 5; i++)
        {
            Assert.Equal(filter.A[i], rebuilt.A[i], 1e-13);
            Assert.Equal(filter.B[i], rebuilt.B[i], 1e-16);
        }
    }

    [Theory]
    [InlineData(1, 10.0, 1000.0)]
    [InlineData(2, 1.0, 2000.0)]
    [InlineData(3, 5.0, 100.0)]
    [InlineData(4, 50.0, 1000.0)]
    [InlineData(7, 0.5, 10.0)]
    public void Magnitude_at_cutoff_is_one_over_root_two_and_unity_at_dc(int order, double cutoffHz, double fs)
    {
        // Definition of the Butterworth −3 dB cutoff; prewarping puts it exactly at f_c. Tolerance 1e-9: at
        // f_c/f_s = 5e-4 the rounding of section coefficients near ±1, 2 alone moves |H| by ~1e-11.
        var filter = ButterworthDesign.LowPass(order, cutoffHz, fs);
        Assert.Equal(1.0 / Math.Sqrt(2.0), filter.Magnitude(cutoffHz, fs), 1e-9);
        Assert.Equal(1.0, filter.Magnitude(0.0, fs), 1e-9);
    }

    [Fact]
    public void Odd_order_has_first_order_section_first()
    {
        var filter = ButterworthDesign.LowPass(3, 0.2, 2.0);
        Assert.True(filter.Sections[0].IsFirstOrder);
        Assert.False(filter.Sections[1].IsFirstOrder);
        Assert.Equal(4, filter.A.Count);
    }

    [Theory]
    [InlineData(2, 0.0, 100.0)]
    [InlineData(2, 50.0, 100.0)]
    [InlineData(2, -1.0, 100.0)]
    [InlineData(0, 10.0, 100.0)]
    [InlineData(2, 10.0, 0.0)]
    [InlineData(2, double.NaN, 100.0)]
    public void Invalid_design_is_refused(int order, double cutoffHz, double fs)
    {
        Assert.Throws<BcPrepDataException>(() => ButterworthDesign.LowPass(order, cutoffHz, fs));
    }
}
