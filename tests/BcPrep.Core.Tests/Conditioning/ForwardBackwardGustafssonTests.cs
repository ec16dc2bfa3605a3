using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class ForwardBackwardGustafssonTests
{
    private static double[] TwoTone() =>
        Enumerable.Range(0, 50).Select(n => Math.Sin(2 * Math.PI * 0.02 * n) + (0.5 * Math.Sin(2 * Math.PI * 0.3 * n))).ToArray();

    [Fact]
    public void Matches_independent_reference_values_of_the_same_method()
    {
        // scipy.signal.filtfilt(b, a, x, method='gust') with b, a = butter(2, 0.2), x[n] = sin(2π·0.02n) + 0.5·sin(2π·0.3n),
        // n = 0…49 (scipy 1.10.1 values in the reference sheet, section 6.2), 10 significant digits.
        var filter = ButterworthDesign.LowPass(2, 0.1, 1.0); // Wn = 0.2 of Nyquist = 0.1 of the sample rate
        var y = ForwardBackwardGustafsson.Apply(filter.B, filter.A, TwoTone());
        Assert.Equal(0.1956536924, y[0], 9);
        Assert.Equal(0.2284612777, y[1], 9);
        Assert.Equal(0.2830564342, y[2], 9);
        Assert.Equal(0.1266293216, y[24], 9);
        Assert.Equal(-0.3854948513, y[47], 9);
        Assert.Equal(-0.3273495919, y[48], 9);
        Assert.Equal(-0.3023763438, y[49], 9);
    }

    [Fact]
    public void Forward_backward_equals_backward_forward_and_a_constant_passes_unchanged()
    {
        var filter = ButterworthDesign.LowPass(4, 0.05, 1.0);
        var x = TwoTone();
        var y = ForwardBackwardGustafsson.Apply(filter.B, filter.A, x);
        var reversed = ForwardBackwardGustafsson.Apply(filter.B, filter.A, x.Reverse().ToArray()).Reverse().ToArray();
        for (int i = 0; i < x.Length; i++)
        {
            Assert.Equal(y[i], reversed[i], 9); // time-reversal symmetry of the method
        }
        Assert.All(ForwardBackwardGustafsson.Apply(filter.B, filter.A, Enumerable.Repeat(3.7, 30).ToArray()), v => Assert.Equal(3.7, v, 9));
    }

    [Fact]
    public void Too_short_or_non_finite_input_is_refused()
    {
        var filter = ButterworthDesign.LowPass(2, 0.1, 1.0);
        Assert.Throws<BcPrepDataException>(() => ForwardBackwardGustafsson.Apply(filter.B, filter.A, new double[4]));
        Assert.Throws<BcPrepDataException>(() => ForwardBackwardGustafsson.Apply(filter.B, filter.A, [1, 2, double.NaN, 4, 5, 6]));
    }

    [Fact]
    public void The_initial_states_are_those_of_the_forward_and_backward_passes_of_Apply()
    {
        // Filtering forward from the forward state and backward from the backward state, in transposed direct form II,
        // must give Apply's result: the streamed chain relies on that meaning of the two states.
        var section = ButterworthDesign.LowPass(4, 2.0, 100.0).Sections[0];
        double[] b = [section.B0, section.B1, section.B2];
        double[] a = [1.0, section.A1, section.A2];
        var random = new Random(3);
        var x = Enumerable.Range(0, 600).Select(i => 20.0 + Math.Sin(i / 15.0) + random.NextDouble()).ToArray();
        var expected = ForwardBackwardGustafsson.Apply(b, a, x);
        var (forward, backward) = ForwardBackwardGustafsson.InitialStates(b, a, x);
        var y = (double[])x.Clone();
        double z0 = forward[0], z1 = forward[1];
        for (var i = 0; i < y.Length; i++)
        {
            var yi = (b[0] * y[i]) + z0;
            z0 = (b[1] * y[i]) - (a[1] * yi) + z1;
            z1 = (b[2] * y[i]) - (a[2] * yi);
            y[i] = yi;
        }
        (z0, z1) = (backward[0], backward[1]);
        for (var i = y.Length - 1; i >= 0; i--)
        {
            var yi = (b[0] * y[i]) + z0;
            z0 = (b[1] * y[i]) - (a[1] * yi) + z1;
            z1 = (b[2] * y[i]) - (a[2] * yi);
            y[i] = yi;
        }
        for (var i = 0; i < y.Length; i++)
        {
            Assert.Equal(expected[i], y[i], 1e-11);
        }
    }
}
