using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class HampelApplyIntoTests
{
    public static TheoryData<int, bool> Cases() => new() { { 3, false }, { 3, true }, { 10, false }, { 10, true }, { 1, false }, { 25, false } };

    [Theory]
    [MemberData(nameof(Cases))]
    public void Writing_into_a_buffer_gives_what_apply_returns(int halfWindow, bool withNaN)
    {
        // Hampel identifier (Pearson 2002 as in the filter's own tests); here only the two entry points are compared.
        var random = new Random(halfWindow + (withNaN ? 100 : 0));
        var x = Enumerable.Range(0, 5000).Select(i => 10.0 + Math.Sin(i * 0.01) + (0.1 * random.NextDouble())).ToArray();
        foreach (var i in new[] { 0, 2, 777, 2500, 4998 })
        {
            x[i] += 4.0;
        }
        if (withNaN)
        {
            x[1000] = double.NaN;
        }
        var expected = HampelFilter.Apply(x, halfWindow, 3.0);
        var output = Enumerable.Repeat(-1.0, x.Length).ToArray();

        var replaced = HampelFilter.ApplyInto(x, output, halfWindow, 3.0);

        Assert.Equal(expected.ReplacedIndices, replaced);
        Assert.Equal(expected.Values.Select(BitConverter.DoubleToInt64Bits), output.Select(BitConverter.DoubleToInt64Bits));
        Assert.Contains(777, replaced);
    }

    [Fact]
    public void An_output_of_another_length_or_over_the_input_is_refused()
    {
        var x = new double[20];
        Assert.Throws<ArgumentException>(() => HampelFilter.ApplyInto(x, new double[19]));
        Assert.Throws<ArgumentException>(() => HampelFilter.ApplyInto(x, x));
    }
}
