using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class MainsNotchTests
{
    // scipy.signal.iirnotch(f0, Q, fs) (Orfanidis 1996 form) [domain reference 6.4; first row is the scipy doc example].
    [Theory]
    [InlineData(60.0, 30.0, 200.0, 0.969531252909, 0.599203267453, 0.939062505817)]
    [InlineData(50.0, 30.0, 1000.0, 0.994791237659, -1.892205377859, 0.989582475319)]
    [InlineData(50.0, 35.0, 1000.0, 0.995532032687, -1.893614453736, 0.991064065374)]
    public void Coefficients_match_scipy_iirnotch(double f0, double q, double fs, double b0, double b1, double a2)
    {
        var s = MainsNotch.Design(f0, q, fs);
        Assert.Equal(b0, s.B0, 1e-11);
        Assert.Equal(b1, s.B1, 1e-11);
        Assert.Equal(b0, s.B2, 1e-11);
        Assert.Equal(b1, s.A1, 1e-11);
        Assert.Equal(a2, s.A2, 1e-11);
    }

    [Fact]
    public void Magnitude_is_zero_at_notch_and_one_at_dc()
    {
        // [domain reference 6.4, CC]: |H| = 1 at DC, ~5e-14 at 50 Hz, 0.99977 at 100 Hz for (50, 30, 1000).
        var filter = IirFilter.FromSections([MainsNotch.Design(50.0, 30.0, 1000.0)]);
        Assert.Equal(1.0, filter.Magnitude(0.0, 1000.0), 1e-12);
        Assert.True(filter.Magnitude(50.0, 1000.0) < 1e-12);
        Assert.Equal(0.99977, filter.Magnitude(100.0, 1000.0), 1e-5);
        Assert.Equal(0.710, filter.Magnitude(50.0 - (50.0 / 60.0), 1000.0), 1e-3);
    }

    [Fact]
    public void Harmonics_stop_below_nyquist()
    {
        var filter = MainsNotch.WithHarmonics(50.0, 30.0, harmonicCount: 20, sampleRateHz: 1000.0);
        Assert.Equal(9, filter.Sections.Count); // 50…450 Hz; 500 Hz is Nyquist.
        for (int k = 1; k <= 9; k++)
        {
            Assert.True(filter.Magnitude(50.0 * k, 1000.0) < 1e-9);
        }
    }

    [Fact]
    public void Zero_phase_notch_removes_mains_and_keeps_slow_signal()
    {
        const double fs = 1000.0;
        var x = new double[20000];
        var slow = new double[x.Length];
        for (int i = 0; i < x.Length; i++)
        {
            slow[i] = 20.0 + Math.Sin(2 * Math.PI * 0.5 * i / fs);
            x[i] = slow[i] + (0.3 * Math.Sin(2 * Math.PI * 50.0 * i / fs)) + (0.1 * Math.Sin(2 * Math.PI * 150.0 * i / fs));
        }

        var y = MainsNotch.Apply(x, 50.0, 30.0, 3, fs);
        for (int i = 5000; i < 15000; i++)
        {
            Assert.Equal(slow[i], y[i], 1e-3);
        }
    }

    [Theory]
    [InlineData(0.0, 30.0, 1000.0)]
    [InlineData(500.0, 30.0, 1000.0)]
    [InlineData(50.0, 0.0, 1000.0)]
    public void Invalid_notch_is_refused(double f0, double q, double fs)
    {
        Assert.Throws<BcPrepDataException>(() => MainsNotch.Design(f0, q, fs));
    }
}
