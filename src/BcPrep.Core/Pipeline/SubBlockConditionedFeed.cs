using System.Runtime.CompilerServices;
using BcPrep.Conditioning;
using BcPrep.Rig;

namespace BcPrep.Pipeline;

/// <summary>
/// The conditioned block means at a fraction of the cost: each detection block is split into sub-blocks that hold
/// whole mains periods (<see cref="SubBlockRate"/>), every channel is averaged over them at the full rate (one add per
/// sample), and the conditioning chain (bridging, Hampel, low-pass; the notch falls above the sub-block rate's Nyquist
/// frequency) runs on the sub-block means, streamed in chunks, before they are averaged into the block means.
/// Only block means are consumed downstream, and the sub-blocks share the detection blocks' edges, so no sub-block
/// straddles two blocks. When no split fits the log (a slow logger, a rate that is not a whole number of samples per
/// sub-block), the chain runs on every sample as before. The split is chosen from the first block's sample interval.
/// </summary>
internal sealed class SubBlockConditionedFeed : IBlockSink
{
    /// <summary>
    /// Detection blocks per conditioning chunk: short, so the block means lag the read by about a minute and the rows
    /// kept back for that lag stay few; at the sub-block rate a chunk costs little however often it comes.
    /// </summary>
    private const int BlocksPerChunk = 64;

    private readonly RigDescription _rig;
    private readonly BlockMeanSink _blocks;
    private readonly double _originS;
    private readonly double _blockS;
    private IBlockSink? _chain;
    private int _perBlock;
    private double _subS;

    private IReadOnlyList<string>? _channels;
    private double[] _sum = [];
    private int[] _count = [];
    private long _current = long.MinValue;
    private int _rowsInCurrent;
    private readonly List<double> _outTimes = [];
    private List<double>[] _outValues = [];

    public SubBlockConditionedFeed(RigDescription rig, BlockMeanSink blocks)
    {
        _rig = rig;
        _blocks = blocks;
        _originS = blocks.OriginS;
        _blockS = blocks.BlockS;
    }

    /// <summary>Sub-blocks per detection block, once chosen; 0 before the first block or when the chain runs on every sample.</summary>
    public int SubBlocksPerBlock => _perBlock;

    /// <summary>The chain that conditions the sub-block means (or every sample); null before the first block.</summary>
    public ConditionedBlockSink? Conditioned => _chain as ConditionedBlockSink;

    public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
    {
        if (_chain is null)
        {
            Choose(timeS, count);
        }
        if (_perBlock == 0)
        {
            _chain!.AcceptBlock(channels, timeS, valuesSi, count);
            return;
        }
        if (_channels is not null && !_channels.SequenceEqual(channels))
        {
            EmitCurrent();
            Flush();
            _current = long.MinValue;
        }
        if (_channels is null || _channels.Count != channels.Count || !_channels.SequenceEqual(channels))
        {
            _channels = channels.ToList();
            _sum = new double[channels.Count];
            _count = new int[channels.Count];
            _outValues = [.. channels.Select(_ => new List<double>())];
        }
        var i = 0;
        while (i < count)
        {
            var sub = SubIndex(timeS[i]);
            if (sub != _current)
            {
                EmitCurrent();
                _current = sub;
            }
            // The run of rows in this sub-block: times increase, so it ends at the first row of a later one.
            var end = i + 1;
            while (end < count && SubIndex(timeS[end]) == sub)
            {
                end++;
            }
            for (var c = 0; c < channels.Count; c++)
            {
                var (s, n) = SumFinite(valuesSi[c].AsSpan(i, end - i));
                _sum[c] += s;
                _count[c] += n;
            }
            _rowsInCurrent += end - i;
            i = end;
        }
        Flush();
    }

    /// <summary>Conditions and passes on what is left; call after the last block.</summary>
    public void Complete()
    {
        if (_perBlock > 0)
        {
            EmitCurrent();
            Flush();
        }
        (_chain as ConditionedBlockSink)?.Complete();
    }

    private void Choose(double[] timeS, int count)
    {
        // The sample interval over spans of many rows: log-clock times are large numbers, so a single step carries
        // the rounding of both stamps (about 1e-5 s on an absolute clock), far more than the 1e-6 the split needs.
        var span = Math.Min(256, count / 4);
        var steps = new List<double>(Math.Max(0, count - span));
        for (var i = 0; span > 0 && i + span < count; i++)
        {
            steps.Add((timeS[i + span] - timeS[i]) / span);
        }
        steps.Sort();
        var c = _rig.Conditioning;
        var perBlock = steps.Count < 16 ? null : SubBlockRate.SubBlocksPerBlock(steps[steps.Count / 2], _blockS, c.MainsHz, c.LowPassCutoffHz);
        var feed = new ChannelSinkFeed(_blocks);
        if (perBlock is int n)
        {
            _perBlock = n;
            _subS = _blockS / n;
            _chain = new ConditionedBlockSink(_rig, feed, Math.Max(16, BlocksPerChunk * n));
        }
        else
        {
            _chain = new ConditionedBlockSink(_rig, feed);
        }
    }

    /// <summary>
    /// The block index is the block-mean sink's own expression, so a sample lands in the same detection block as it
    /// would unsplit; the sub-block within it comes from the offset into that block.
    /// </summary>
    private long SubIndex(double timeS)
    {
        var block = (long)Math.Floor((timeS - _originS) / _blockS);
        var within = (long)Math.Floor((timeS - _originS - (block * _blockS)) / _subS);
        return (block * _perBlock) + Math.Clamp(within, 0, _perBlock - 1);
    }

    private void EmitCurrent()
    {
        if (_rowsInCurrent == 0)
        {
            return; // no row in it: a time jump, which the chain sees as one
        }
        var block = Math.DivRem(_current, _perBlock, out var within);
        if (within < 0)
        {
            block--;
            within += _perBlock;
        }
        _outTimes.Add(_originS + (block * _blockS) + ((within + 0.5) * _subS));
        for (var c = 0; c < _sum.Length; c++)
        {
            _outValues[c].Add(_count[c] > 0 ? _sum[c] / _count[c] : double.NaN);
            _sum[c] = 0.0;
            _count[c] = 0;
        }
        _rowsInCurrent = 0;
    }

    private void Flush()
    {
        if (_outTimes.Count == 0 || _channels is null)
        {
            return;
        }
        var times = _outTimes.ToArray();
        var values = _outValues.Select(v => v.ToArray()).ToArray();
        _outTimes.Clear();
        foreach (var v in _outValues)
        {
            v.Clear();
        }
        _chain!.AcceptBlock(_channels, times, values, times.Length);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static (double Sum, int Count) SumFinite(ReadOnlySpan<double> values)
    {
        var sum = 0.0;
        var n = 0;
        foreach (var v in values)
        {
            if (!double.IsNaN(v))
            {
                sum += v;
                n++;
            }
        }
        return (sum, n);
    }

    /// <summary>Hands the rows of conditioned blocks to a channel sink, channel by channel.</summary>
    private sealed class ChannelSinkFeed(IChannelSink sink) : IBlockSink
    {
        public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
        {
            for (var c = 0; c < channels.Count; c++)
            {
                sink.Accept(channels[c], timeS.AsSpan(0, count), valuesSi[c].AsSpan(0, count));
            }
        }
    }
}
