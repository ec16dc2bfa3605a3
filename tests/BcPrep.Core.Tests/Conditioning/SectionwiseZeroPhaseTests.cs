using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class SectionwiseZeroPhaseTests
{
    // Reference: scipy.signal.filtfilt(b, a, x, padtype='odd', padlen=49) (scipy 1.10.1, Debian python3-scipy) with
    // b, a = butter(2, 0.2) on x[n] = sin(2π·0.02n) + 0.5·sin(2π·0.3n), n = 0..49, the record of the reference sheet
    // §6.2. The section settles to 1e-14 over more than the record, so the chain reflects the whole record (pad n − 1).
    [Fact]
    public void One_fast_section_reproduces_scipy_padded_filtering_with_the_whole_record_reflected()
    {
        var x = Enumerable.Range(0, 50).Select(n => Math.Sin(2 * Math.PI * 0.02 * n) + (0.5 * Math.Sin(2 * Math.PI * 0.3 * n))).ToArray();
        var filter = ButterworthDesign.LowPass(2, 0.1, 1.0); // f_c/f_s = 0.1 is scipy's Wn = 0.2
        Assert.Equal(49, ChannelConditioner.EdgePad(filter.Sections[0], x.Length));

        ChannelConditioner.FilterZeroPhase(filter.Sections, x);

        Assert.Equal(4.3731008397829285e-11, x[0], 9);
        Assert.Equal(0.12662953365863042, x[1], 9);
        Assert.Equal(0.2474308932388063, x[2], 9);
        Assert.Equal(0.12662352029741158, x[24], 9);
        Assert.Equal(-0.4702634587294545, x[47], 9);
        Assert.Equal(-0.5093157349140076, x[48], 9);
        Assert.Equal(-0.6008614916789236, x[49], 9);
    }

    // Reference: scipy.signal.filtfilt(b, a, x, padtype='odd', padlen=14512) (scipy 1.10.1) with b, a =
    // butter(2, 0.5, fs=1000) — a 0.5 Hz low-pass at 1 kHz, pole radius 0.99778, settling to 1e-14 in 14 512 samples —
    // on 60 s of a barometer-like signal: 98 644 + 20·sin(2π·0.01t + 0.3) + 3·sin(2π·50t) + 0.5·sin(2π·123.4t).
    [Fact]
    public void A_slow_section_reproduces_scipy_padded_filtering_over_its_settling_length()
    {
        const double fs = 1000.0;
        var x = Enumerable.Range(0, 60_000).Select(n => n / fs)
            .Select(t => 98644.0 + (20 * Math.Sin((2 * Math.PI * 0.01 * t) + 0.3)) + (3 * Math.Sin(2 * Math.PI * 50 * t)) + (0.5 * Math.Sin(2 * Math.PI * 123.4 * t)))
            .ToArray();
        var filter = ButterworthDesign.LowPass(2, 0.5, fs);
        Assert.Equal(14_512, ChannelConditioner.EdgePad(filter.Sections[0], x.Length));

        ChannelConditioner.FilterZeroPhase(filter.Sections, x);

        // 1e-9 of the level: the two implementations round differently over 89 000 recursions of a pole this close to 1.
        const double tolerance = 1e-4;
        Assert.Equal(98649.91040434413, x[0], tolerance);
        Assert.Equal(98649.91159961003, x[1], tolerance);
        Assert.Equal(98649.91279487495, x[2], tolerance);
        Assert.Equal(98660.34516228896, x[30_000], tolerance);
        Assert.Equal(98626.71865833102, x[^3], tolerance);
        Assert.Equal(98626.71505405549, x[^2], tolerance);
        Assert.Equal(98626.71144975297, x[^1], tolerance);
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(20.0)]
    public void A_constant_level_comes_out_unchanged_at_the_ends_of_a_segment(double cutoffHz)
    {
        // Analytic check: every section has a steady state, so a constant passes a zero-phase cascade of unit DC gain
        // unchanged everywhere, its first and last samples included. Gustafsson's states, used before, gave 0.36 Pa
        // for this 98 644 Pa level at the first sample (0.5 Hz) and 541 Pa (20 Hz), through the mains notches' slow poles.
        const double fs = 1000.0;
        var sections = MainsNotch.WithHarmonics(50.0, 30.0, 3, fs).Sections.Concat(ButterworthDesign.LowPass(4, cutoffHz, fs).Sections).ToList();
        var x = Enumerable.Repeat(98644.0, 100_000).ToArray();

        ChannelConditioner.FilterZeroPhase(sections, x);

        // 1e-10 of the level: the sections' DC gains differ from 1 by rounding (a 0.5 Hz biquad at 1 kHz has b ≈ 2.5e-6).
        Assert.All(x, v => Assert.Equal(98644.0, v, 1e-5));
    }

    [Fact]
    public void A_ramp_keeps_its_level_and_slope_to_the_ends_of_a_segment()
    {
        // Analytic check: the odd extension of a ramp is the same ramp continued, and a zero-phase filter of unit DC
        // gain passes a ramp unchanged, so the ends see no transient (a heater warming a wall at 2 K per minute).
        const double fs = 1000.0;
        var sections = MainsNotch.WithHarmonics(50.0, 30.0, 3, fs).Sections.Concat(ButterworthDesign.LowPass(4, 0.5, fs).Sections).ToList();
        var x = Enumerable.Range(0, 100_000).Select(n => 300.0 + (2.0 / 60.0 * n / fs)).ToArray();
        var expected = (double[])x.Clone();

        ChannelConditioner.FilterZeroPhase(sections, x);

        for (var n = 0; n < x.Length; n++)
        {
            Assert.Equal(expected[n], x[n], 1e-7); // 3e-10 of the level
        }
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
