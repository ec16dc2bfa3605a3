using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class ZeroPhaseFilterTests
{
    private static readonly IirFilter Butter2 = ButterworthDesign.LowPass(2, 0.2, 2.0);

    [Fact]
    public void Step_state_matches_scipy_lfilter_zi()
    {
        // scipy 1.10.1 lfilter_zi(butter(2, 0.2)) and lfilter_zi(butter(4, 0.1)) [domain reference 6.2, CC].
        var zi2 = ZeroPhaseFilter.StepResponseState(Butter2.B, Butter2.A);
        Assert.Equal(0.932544726111, zi2[0], 1e-9);
        Assert.Equal(-0.345346324207, zi2[1], 1e-9);

        var butter4 = ButterworthDesign.LowPass(4, 0.1, 2.0);
        var zi4 = ZeroPhaseFilter.StepResponseState(butter4.B, butter4.A);
        double[] expected = [0.9995834008, -2.1827215449, 1.6759732089, -0.4378485431];
        for (int i = 0; i < 4; i++)
        {
            Assert.Equal(expected[i], zi4[i], 1e-9);
        }
    }

    [Fact]
    public void Constant_input_passes_unchanged_in_both_forms()
    {
        // scipy filtfilt of a constant 3.7 (n = 30) returns 3.7 everywhere [domain reference 6.2, CC].
        var x = Enumerable.Repeat(3.7, 30).ToArray();
        var tf = ZeroPhaseFilter.ForwardBackwardPadded(Butter2.B, Butter2.A, x);
        var butter4 = ButterworthDesign.LowPass(4, 0.1, 2.0);
        var sos = ZeroPhaseFilter.ForwardBackwardPadded(butter4.Sections, x);
        Assert.All(tf, v => Assert.Equal(3.7, v, 1e-12));
        Assert.All(sos, v => Assert.Equal(3.7, v, 1e-12));
    }

    private static double[] SineTestSignal()
    {
        var x = new double[50];
        for (int n = 0; n < 50; n++)
        {
            x[n] = Math.Sin(2 * Math.PI * 0.02 * n) + (0.5 * Math.Sin(2 * Math.PI * 0.3 * n));
        }

        return x;
    }

    [Fact]
    public void Transfer_function_form_reproduces_the_padded_reference_sine_vector()
    {
        // scipy 1.10.1 filtfilt(butter(2, 0.2), x) with default padlen 9 [domain reference 6.2, CC].
        var y = ZeroPhaseFilter.ForwardBackwardPadded(Butter2.B, Butter2.A, SineTestSignal());
        Assert.Equal(9, ZeroPhaseFilter.DefaultPadLength(Butter2.B, Butter2.A));
        double[] head = [-0.001401061, 0.1271672873, 0.2486238954, 0.3678394938, 0.4833619905, 0.5874173859];
        for (int i = 0; i < head.Length; i++)
        {
            Assert.Equal(head[i], y[i], 1e-9);
        }

        Assert.Equal(0.12662344923, y[24], 1e-9);
        Assert.Equal(-5.16087e-06, y[25], 1e-9);
        double[] tail = [-0.4933100838, -0.4705270499, -0.5088500701, -0.5989335994];
        for (int i = 0; i < tail.Length; i++)
        {
            Assert.Equal(tail[i], y[46 + i], 1e-9);
        }
    }

    [Fact]
    public void Section_form_with_same_pad_equals_transfer_function_form()
    {
        var x = SineTestSignal();
        var tf2 = ZeroPhaseFilter.ForwardBackwardPadded(Butter2.B, Butter2.A, x);
        var sos2 = ZeroPhaseFilter.ForwardBackwardPadded(Butter2.Sections, x, padLength: 9);
        var butter4 = ButterworthDesign.LowPass(4, 0.1, 2.0);
        var tf4 = ZeroPhaseFilter.ForwardBackwardPadded(butter4.B, butter4.A, x, padLength: 15);
        var sos4 = ZeroPhaseFilter.ForwardBackwardPadded(butter4.Sections, x, padLength: 15);
        for (int i = 0; i < x.Length; i++)
        {
            Assert.Equal(tf2[i], sos2[i], 1e-12);
            Assert.Equal(tf4[i], sos4[i], 1e-10);
        }
    }

    [Fact]
    public void Section_default_pad_follows_scipy_sosfiltfilt()
    {
        // scipy PR #6274: 3·(2·n_sections + 1), less the count of first-order sections.
        Assert.Equal(15, ZeroPhaseFilter.DefaultPadLength(ButterworthDesign.LowPass(4, 0.1, 2.0).Sections));
        Assert.Equal(12, ZeroPhaseFilter.DefaultPadLength(ButterworthDesign.LowPass(3, 0.1, 2.0).Sections));
    }

    [Theory]
    [InlineData(10.0)]
    [InlineData(40.0)]
    [InlineData(50.0)]
    [InlineData(80.0)]
    public void Zero_phase_gain_is_analytic_butterworth_magnitude_squared(double frequencyHz)
    {
        // Digital Butterworth by bilinear transform: |H|² = 1/(1 + (tan(πf/f_s)/tan(πf_c/f_s))^(2N)) (analytic);
        // forward–backward gives |H|² with zero phase.
        const double fs = 1000.0, fc = 50.0;
        const int order = 4, n = 20000;
        var filter = ButterworthDesign.LowPass(order, fc, fs);
        var x = new double[n];
        for (int i = 0; i < n; i++)
        {
            x[i] = Math.Sin(2 * Math.PI * frequencyHz * i / fs);
        }

        var y = ZeroPhaseFilter.ForwardBackwardPadded(filter.Sections, x);
        double ratio = Math.Tan(Math.PI * frequencyHz / fs) / Math.Tan(Math.PI * fc / fs);
        double expected = 1.0 / (1.0 + Math.Pow(ratio, 2 * order));

        // Project the interior onto sin and cos over 10 000 samples = whole number of periods for these frequencies.
        double s = 0, c = 0;
        for (int i = 5000; i < 15000; i++)
        {
            double w = 2 * Math.PI * frequencyHz * i / fs;
            s += y[i] * Math.Sin(w);
            c += y[i] * Math.Cos(w);
        }

        Assert.Equal(expected, 2.0 * s / 10000, 1e-9);
        Assert.Equal(0.0, 2.0 * c / 10000, 1e-9);
    }

    [Fact]
    public void Series_not_longer_than_pad_is_refused()
    {
        var x = new double[9];
        Assert.Throws<BcPrepDataException>(() => ZeroPhaseFilter.ForwardBackwardPadded(Butter2.B, Butter2.A, x));
        Assert.Throws<BcPrepDataException>(() => ZeroPhaseFilter.ForwardBackwardPadded(Butter2.Sections, x, 9));
        Assert.Equal(10, ZeroPhaseFilter.ForwardBackwardPadded(Butter2.B, Butter2.A, new double[10]).Length);
    }

    [Fact]
    public void Non_finite_sample_is_refused()
    {
        var x = new double[40];
        x[17] = double.NaN;
        var ex = Assert.Throws<BcPrepDataException>(() => ZeroPhaseFilter.ForwardBackwardPadded(Butter2.Sections, x));
        Assert.Contains("17", ex.Message, StringComparison.Ordinal);
    }
}
