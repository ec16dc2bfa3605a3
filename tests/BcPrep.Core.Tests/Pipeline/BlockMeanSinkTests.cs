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

    [Fact]
    public void Whole_blocks_give_the_same_means_as_channel_by_channel_feeding()
    {
        // Reference: the channel-by-channel path above, itself checked against the definition.
        var random = new Random(9);
        var times = Enumerable.Range(0, 4000).Select(i => 50.0 + (i * 0.011)).ToArray();
        var a = times.Select((t, i) => i % 53 == 0 ? double.NaN : Math.Cos(t) + random.NextDouble()).ToArray();
        var b = times.Select(t => 300.0 + t).ToArray();
        var byChannel = new BlockMeanSink(50.0, 0.5);
        var byBlock = new BlockMeanSink(50.0, 0.5);
        for (var start = 0; start < times.Length; start += 700)
        {
            var n = Math.Min(700, times.Length - start);
            byChannel.Accept("a", times.AsSpan(start, n), a.AsSpan(start, n));
            byChannel.Accept("b", times.AsSpan(start, n), b.AsSpan(start, n));
            byBlock.AcceptBlock(["a", "b"], times[start..(start + n)], [a[start..(start + n)], b[start..(start + n)]], n);
        }

        Assert.Equal(byChannel.Length, byBlock.Length);
        Assert.Equal(byChannel.Means("a", byChannel.Length), byBlock.Means("a", byBlock.Length));
        Assert.Equal(byChannel.Means("b", byChannel.Length), byBlock.Means("b", byBlock.Length));
    }
}
