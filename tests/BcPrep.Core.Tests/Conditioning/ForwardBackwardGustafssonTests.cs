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
}
