using System.Runtime.CompilerServices;

namespace BcPrep.Pipeline;

/// <summary>
/// Averages every channel over fixed blocks of time (e.g. 1 s) during the scan. The block means are what steady
/// detection and the day plots look at: small (one value per block) whatever the sample rate.
/// </summary>
public sealed class BlockMeanSink : IChannelSink, IBlockSink
{
    private readonly double _originS;
    private readonly double _blockS;
    private readonly Dictionary<string, (List<double> Sum, List<int> Count)> _channels = new(StringComparer.Ordinal);
    private readonly List<(int Index, int Start, int End)> _runs = [];
    private readonly Dictionary<string, int> _latestBlock = new(StringComparer.Ordinal);

    public BlockMeanSink(double originS, double blockS)
    {
        _originS = originS;
        _blockS = blockS;
    }

    public double BlockS => _blockS;

    public double OriginS => _originS;

    public void Accept(string channel, ReadOnlySpan<double> timeS, ReadOnlySpan<double> valueSi)
    {
        FindRuns(timeS, _originS, _blockS, _runs);
        AddRuns(Accumulator(channel), valueSi);
        NoteLatest(channel);
    }

    public void Complete(string channel)
    {
    }

    /// <summary>
    /// A logger's whole block: its channels share the time stamps, so the runs of samples that fall in one averaging
    /// block are found once and every channel is summed over them. Same sums as <see cref="Accept"/> channel by channel.
    /// </summary>
    public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
    {
        FindRuns(timeS.AsSpan(0, count), _originS, _blockS, _runs);
        for (var c = 0; c < channels.Count; c++)
        {
            AddRuns(Accumulator(channels[c]), valuesSi[c]);
            NoteLatest(channels[c]);
        }
    }

    /// <summary>
    /// Blocks 0 … FinalBlocks − 1 can no longer change: every channel has had a sample in a later block, and times
    /// increase. (A block with no sample of a channel is final all the same; its mean is NaN.)
    /// </summary>
    public int FinalBlocks => _latestBlock.Count == 0 ? 0 : _latestBlock.Values.Min();

    /// <summary>Mean of one block of a channel, as <see cref="Means"/> gives it; NaN where the block had no sample.</summary>
    public double MeanAt(string channel, int index) => _channels.TryGetValue(channel, out var acc) ? MeanAt(acc, index) : double.NaN;

    private static double MeanAt((List<double> Sum, List<int> Count) acc, int index) =>
        index < acc.Sum.Count && acc.Count[index] > 0 ? acc.Sum[index] / acc.Count[index] : double.NaN;

    /// <summary>Centre of block <paramref name="index"/> on the log clock (s), as <see cref="Times"/> gives it.</summary>
    public double TimeAt(int index) => _originS + (index + 0.5) * _blockS;

    private void NoteLatest(string channel)
    {
        if (_runs.Count > 0)
        {
            _latestBlock[channel] = _runs[^1].Index;
        }
    }

    /// <summary>Adds each run's finite samples to its block: the lists are touched once per run, not once per sample.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void AddRuns((List<double> Sum, List<int> Count) acc, ReadOnlySpan<double> values)
    {
        foreach (var (index, start, end) in _runs)
        {
            var sum = 0.0;
            var n = 0;
            for (var i = start; i < end; i++)
            {
                var v = values[i];
                if (!double.IsNaN(v))
                {
                    sum += v;
                    n++;
                }
            }
            Add(acc, index, sum, n);
        }
    }

    /// <summary>
    /// Times increase, so samples come in runs that share an averaging block. The run's first sample always belongs
    /// to it, even where rounding puts it on the block's end.
    /// </summary>
    internal static void FindRuns(ReadOnlySpan<double> timeS, double originS, double blockS, List<(int Index, int Start, int End)> runs)
    {
        runs.Clear();
        var i = 0;
        while (i < timeS.Length)
        {
            var index = (int)Math.Floor((timeS[i] - originS) / blockS);
            var blockEndS = originS + ((index + 1) * blockS);
            var start = i;
            for (var first = true; i < timeS.Length && (first || timeS[i] < blockEndS); i++, first = false)
            {
            }
            runs.Add((index, start, i));
        }
    }

    /// <summary>
    /// Adds the sum and count of finite samples that a feed of its own has already reduced to block
    /// <paramref name="index"/> (<see cref="DespikedBlockFeed"/>), as <see cref="Accept"/> adds a run.
    /// </summary>
    internal void AddBlock(string channel, int index, double sum, int count) => Add(Accumulator(channel), index, sum, count);

    /// <summary>Notes that <paramref name="channel"/> has had a sample in block <paramref name="index"/> (see <see cref="FinalBlocks"/>).</summary>
    internal void NoteLatest(string channel, int index)
    {
        _latestBlock[channel] = index;
        Accumulator(channel);
    }

    private (List<double> Sum, List<int> Count) Accumulator(string channel)
    {
        if (!_channels.TryGetValue(channel, out var acc))
        {
            acc = ([], []);
            _channels[channel] = acc;
        }
        return acc;
    }

    private static void Add((List<double> Sum, List<int> Count) acc, int index, double sum, int count)
    {
        if (count == 0)
        {
            return;
        }
        while (acc.Sum.Count <= index)
        {
            acc.Sum.Add(0.0);
            acc.Count.Add(0);
        }
        acc.Sum[index] += sum;
        acc.Count[index] += count;
    }

    /// <summary>Block means of a channel on the common block grid; NaN where a block had no sample.</summary>
    public double[] Means(string channel, int length)
    {
        var result = new double[length];
        if (!_channels.TryGetValue(channel, out var acc))
        {
            Array.Fill(result, double.NaN);
            return result;
        }
        for (var i = 0; i < length; i++)
        {
            result[i] = MeanAt(acc, i);
        }
        return result;
    }

    /// <summary>Number of blocks covering every channel's data.</summary>
    public int Length => _channels.Count == 0 ? 0 : _channels.Values.Max(a => a.Sum.Count);

    /// <summary>Block centre times on the log clock (s).</summary>
    public double[] Times(int length) => Enumerable.Range(0, length).Select(TimeAt).ToArray();
}
