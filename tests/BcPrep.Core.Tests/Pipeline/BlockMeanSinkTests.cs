using BcPrep.Pipeline;

namespace BcPrep.Tests.Pipeline;

public class BlockMeanSinkTests
{
    [Fact]
    public void Block_means_equal_a_per_sample_reference_whatever_the_block_boundaries_of_the_scan()
    {
        // Reference: the plain definition, every finite sample added to block floor((t − t0)/Δ).
        var random = new Random(5);
        var times = Enumerable.Range(0, 5000).Select(i => 100.0 + (i * 0.013) + (random.NextDouble() * 0.001)).ToArray();
        var values = times.Select((t, i) => i % 97 == 0 ? double.NaN : Math.Sin(t) + random.NextDouble()).ToArray();
        var sink = new BlockMeanSink(100.0, 0.25);
        for (var start = 0; start < times.Length; start += 333)
        {
            var n = Math.Min(333, times.Length - start);
            sink.Accept("x", times.AsSpan(start, n), values.AsSpan(start, n));
        }

        var length = sink.Length;
        var means = sink.Means("x", length);
        var sums = new double[length];
        var counts = new int[length];
        for (var i = 0; i < times.Length; i++)
        {
            if (!double.IsNaN(values[i]))
            {
                var k = (int)Math.Floor((times[i] - 100.0) / 0.25);
                sums[k] += values[i];
                counts[k]++;
            }
        }
        for (var k = 0; k < length; k++)
        {
            Assert.Equal(counts[k] == 0 ? double.NaN : sums[k] / counts[k], means[k], 12);
        }
    }
}
