using System.Runtime.CompilerServices;
using BcPrep.Conditioning;
using BcPrep.Rig;

namespace BcPrep.Pipeline;

/// <summary>
/// The block means for detection and the day plots from raw samples with their spikes removed first, when no notch
/// or low-pass is set (with one, the conditioning chain's own Hampel step does it, <see cref="SubBlockConditionedFeed"/>).
/// A spike of 1000 σ in one sample of a 10 Hz block moves its mean by 100 σ; it would pass for a step or wreck the
/// scatter of a plateau. Each block is de-spiked by the window statistics' Hampel rule (the rig's
/// <c>hampel_half_window</c> and <c>hampel_sigmas</c>, the channel's resolution as the floor of the robust σ) before its
/// samples are averaged, with the last samples of the block before it and the first ones of the block after it around
/// it, so that its edge samples get whole windows (a window cut short at a rising edge has a median that lags).
/// <para>
/// Cost: running Hampel on every sample would cost more than parsing it, so a block goes through Hampel only when it
/// may hold a spike: when its range (max − min) exceeds <see cref="RangeFactor"/> times the median range of the
/// <see cref="History"/> blocks before it, or when fewer than <see cref="MinHistory"/> blocks came before. Any other
/// block is averaged as it is, in the same single pass that finds its range. A spike such a block could still hide
/// lies within twice the usual range of the block, so it moves the block mean by at most 2·range/n: 0.6 σ of white
/// noise at 10 samples a block, 0.013 σ at 1000, about what Hampel itself lets through at 6 robust σ. Steps, gaps and
/// the day's first blocks go through Hampel, whose moving median follows a step.
/// </para>
/// <para>
/// Blocks become final in time order, as <see cref="BlockMeanSink.FinalBlocks"/> says: the block a read block ends in
/// is held back (its samples copied) until a sample of a later block arrives, so a block that straddles two read
/// blocks is de-spiked whole, and a block that goes through Hampel waits, one block longer, for the next block's
/// first samples. <see cref="Complete"/> averages what is still held.
/// </para>
/// </summary>
internal sealed class DespikedBlockFeed : IBlockSink
{
    /// <summary>Ranges beyond this multiple of the recent median range send a block through Hampel (our choice).</summary>
    public const double RangeFactor = 2.0;

    /// <summary>Blocks whose ranges make the reference (our choice: short enough to follow a change of noise level).</summary>
    public const int History = 15;

    /// <summary>Blocks that must precede before the screen is trusted; the first ones all go through Hampel.</summary>
    public const int MinHistory = 5;

    private readonly BlockMeanSink _blocks;
    private readonly int _halfWindow;
    private readonly double _sigmas;
    private readonly Func<string, double> _floor;
    private readonly Dictionary<string, ChannelState> _states = new(StringComparer.Ordinal);
    private readonly List<(int Index, int Start, int End)> _runs = [];

    /// <summary>Each run's summary of each channel (channel-major) of the read block at hand; see <see cref="SummariseRuns"/>.</summary>
    private (double Sum, int Count, double Min, double Max)[] _summaries = [];

    public DespikedBlockFeed(RigDescription rig, BlockMeanSink blocks)
        : this(blocks, rig.Conditioning.HampelHalfWindow, rig.Conditioning.HampelSigmas, Floors(rig))
    {
    }

    /// <param name="blocks">The block means to fill.</param>
    /// <param name="halfWindow">Hampel k (samples each side).</param>
    /// <param name="sigmas">Hampel n_σ.</param>
    /// <param name="floor">Floor of the robust σ of a channel (its resolution), in its SI unit.</param>
    public DespikedBlockFeed(BlockMeanSink blocks, int halfWindow, double sigmas, Func<string, double> floor)
    {
        _blocks = blocks;
        _halfWindow = halfWindow;
        _sigmas = sigmas;
        _floor = floor;
    }

    /// <summary>Blocks that went through Hampel (for tests and the benchmark's notes).</summary>
    public long BlocksDespiked { get; private set; }

    /// <summary>Blocks averaged, in all.</summary>
    public long BlocksAveraged { get; private set; }

    public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
    {
        BlockMeanSink.FindRuns(timeS.AsSpan(0, count), _blocks.OriginS, _blocks.BlockS, _runs);
        if (_runs.Count == 0)
        {
            return;
        }
        SummariseRuns(valuesSi, channels.Count);
        for (var c = 0; c < channels.Count; c++)
        {
            var channel = channels[c];
            var state = State(channel);
            var values = valuesSi[c];
            for (var r = 0; r < _runs.Count; r++)
            {
                var (index, start, end) = _runs[r];
                var run = values.AsSpan(start, end - start);
                if (state.PendingCount > 0 && state.PendingIndex == index)
                {
                    state.Append(run); // the rest of a block the previous read block ended in
                    if (r < _runs.Count - 1)
                    {
                        Close(channel, state, state.PendingIndex, state.Pending.AsSpan(0, state.PendingCount));
                        state.PendingCount = 0;
                    }
                    continue;
                }
                if (state.PendingCount > 0)
                {
                    Close(channel, state, state.PendingIndex, state.Pending.AsSpan(0, state.PendingCount));
                    state.PendingCount = 0;
                }
                if (r == _runs.Count - 1)
                {
                    state.PendingIndex = index;
                    state.Append(run); // may go on in the next read block
                }
                else
                {
                    Close(channel, state, index, run, _summaries[(c * _runs.Count) + r]);
                }
            }
            // Blocks before the first one not yet added are final: the one waiting for its right context, else the
            // one held back.
            _blocks.NoteLatest(channel, state.WaitingCount > 0 ? state.WaitingIndex : _runs[^1].Index);
        }
    }

    /// <summary>Averages the blocks still held back; call after the last read block.</summary>
    public void Complete()
    {
        foreach (var (channel, state) in _states)
        {
            if (state.PendingCount > 0)
            {
                Close(channel, state, state.PendingIndex, state.Pending.AsSpan(0, state.PendingCount));
                state.PendingCount = 0;
            }
            if (state.WaitingCount > 0)
            {
                FinishWaiting(channel, state, []);
            }
        }
    }

    /// <summary>
    /// A whole block has arrived: it gives the block waiting for it its right context, and is then averaged as it is,
    /// or, when it may hold a spike, waits itself for the first samples of the next block.
    /// </summary>
    private void Close(string channel, ChannelState state, int index, ReadOnlySpan<double> block) => Close(channel, state, index, block, Summarise(block));

    /// <summary>As <see cref="Close(string, ChannelState, int, ReadOnlySpan{double})"/>, with the block's <see cref="Summarise"/> worked out beforehand (<see cref="SummariseRuns"/>).</summary>
    private void Close(string channel, ChannelState state, int index, ReadOnlySpan<double> block, (double Sum, int Count, double Min, double Max) summary)
    {
        if (state.WaitingCount > 0)
        {
            FinishWaiting(channel, state, state.WaitingIndex == index - 1 ? block[..Math.Min(_halfWindow, block.Length)] : []);
        }
        var (sum, n, min, max) = summary;
        BlocksAveraged++;
        if (n > 0)
        {
            var range = max - min;
            var usual = state.ReferenceRange();
            state.NoteRange(range);
            if (usual is not double u || range > RangeFactor * u)
            {
                state.Wait(index, block, n, _halfWindow);
                BlocksDespiked++;
            }
            else
            {
                _blocks.AddBlock(channel, index, sum, n);
            }
        }
        state.KeepContext(index, block, _halfWindow);
    }

    /// <summary>
    /// Sum of the waiting block's finite samples after Hampel, with the previous block's last samples and the next
    /// block's first ones around it (where those blocks are its neighbours) so that its edge samples get whole
    /// windows; Hampel leaves NaN as it is, so the count stays.
    /// </summary>
    private void FinishWaiting(string channel, ChannelState state, ReadOnlySpan<double> right)
    {
        var (x, total, before, length) = state.WaitingWith(right);
        var cleaned = HampelFilter.Apply(x.AsSpan(0, total), _halfWindow, _sigmas, _floor(channel)).Values;
        var sum = 0.0;
        for (var i = before; i < before + length; i++)
        {
            if (!double.IsNaN(cleaned[i]))
            {
                sum += cleaned[i];
            }
        }
        _blocks.AddBlock(channel, state.WaitingIndex, sum, state.WaitingCount);
        state.WaitingCount = 0;
    }

    /// <summary>
    /// <see cref="Summarise"/> of every run but the last (which waits for the next read block) of every channel, into
    /// <see cref="_summaries"/> (channel-major): four channels at a time, so that four sums run side by side. Each sum
    /// adds its channel's samples in order, the same additions as <see cref="Summarise"/>, so the same bits; one sum
    /// alone waits for each addition before the next (about half of the main thread's time in this feed).
    /// </summary>
    private void SummariseRuns(IReadOnlyList<double[]> valuesSi, int channels)
    {
        var runs = _runs.Count;
        if (_summaries.Length < channels * runs)
        {
            _summaries = new (double, int, double, double)[channels * runs];
        }
        for (var r = 0; r < runs - 1; r++)
        {
            var (_, start, end) = _runs[r];
            var c = 0;
            for (; c + 4 <= channels; c += 4)
            {
                var (s0, s1, s2, s3) = SummariseFour(valuesSi[c].AsSpan(start, end - start), valuesSi[c + 1].AsSpan(start, end - start),
                    valuesSi[c + 2].AsSpan(start, end - start), valuesSi[c + 3].AsSpan(start, end - start));
                _summaries[(c * runs) + r] = s0;
                _summaries[((c + 1) * runs) + r] = s1;
                _summaries[((c + 2) * runs) + r] = s2;
                _summaries[((c + 3) * runs) + r] = s3;
            }
            for (; c < channels; c++)
            {
                _summaries[(c * runs) + r] = Summarise(valuesSi[c].AsSpan(start, end - start));
            }
        }
    }

    /// <summary><see cref="Summarise"/> of four runs of the same length, each with its own sum, count, minimum and maximum.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static ((double, int, double, double), (double, int, double, double), (double, int, double, double), (double, int, double, double)) SummariseFour(
        ReadOnlySpan<double> a, ReadOnlySpan<double> b, ReadOnlySpan<double> c, ReadOnlySpan<double> d)
    {
        var length = a.Length;
        if (b.Length != length || c.Length != length || d.Length != length)
        {
            throw new ArgumentException("The four runs must be equally long.", nameof(b));
        }
        double sa = 0.0, sb = 0.0, sc = 0.0, sd = 0.0;
        int na = 0, nb = 0, nc = 0, nd = 0;
        double mina = double.PositiveInfinity, minb = double.PositiveInfinity, minc = double.PositiveInfinity, mind = double.PositiveInfinity;
        double maxa = double.NegativeInfinity, maxb = double.NegativeInfinity, maxc = double.NegativeInfinity, maxd = double.NegativeInfinity;
        for (var i = 0; i < length; i++)
        {
            var va = a[i];
            var vb = b[i];
            var vc = c[i];
            var vd = d[i];
            if (!double.IsNaN(va))
            {
                sa += va;
                na++;
                mina = Math.Min(mina, va);
                maxa = Math.Max(maxa, va);
            }
            if (!double.IsNaN(vb))
            {
                sb += vb;
                nb++;
                minb = Math.Min(minb, vb);
                maxb = Math.Max(maxb, vb);
            }
            if (!double.IsNaN(vc))
            {
                sc += vc;
                nc++;
                minc = Math.Min(minc, vc);
                maxc = Math.Max(maxc, vc);
            }
            if (!double.IsNaN(vd))
            {
                sd += vd;
                nd++;
                mind = Math.Min(mind, vd);
                maxd = Math.Max(maxd, vd);
            }
        }
        return ((sa, na, mina, maxa), (sb, nb, minb, maxb), (sc, nc, minc, maxc), (sd, nd, mind, maxd));
    }

    /// <summary>Sum, count, minimum and maximum of the finite samples, in one pass.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static (double Sum, int Count, double Min, double Max) Summarise(ReadOnlySpan<double> values)
    {
        var sum = 0.0;
        var n = 0;
        var min = double.PositiveInfinity;
        var max = double.NegativeInfinity;
        foreach (var v in values)
        {
            if (!double.IsNaN(v))
            {
                sum += v;
                n++;
                min = Math.Min(min, v);
                max = Math.Max(max, v);
            }
        }
        return (sum, n, min, max);
    }

    private ChannelState State(string channel)
    {
        if (!_states.TryGetValue(channel, out var state))
        {
            state = new ChannelState();
            _states[channel] = state;
        }
        return state;
    }

    private static Func<string, double> Floors(RigDescription rig)
    {
        var floors = rig.Channels.ToDictionary(c => c.Id, ChannelConditioningPlan.Resolution, StringComparer.Ordinal);
        return channel => floors.GetValueOrDefault(channel);
    }

    /// <summary>Per channel: the block held back, the recent ranges, the previous block's last samples.</summary>
    private sealed class ChannelState
    {
        private readonly double[] _ranges = new double[History];
        private readonly double[] _sorted = new double[History];
        private int _rangeCount;
        private int _rangeNext;
        private double[] _scratch = [];

        public double[] Pending { get; private set; } = new double[64];

        public int PendingCount { get; set; }

        public int PendingIndex { get; set; }

        public double[] Context { get; private set; } = [];

        public int ContextCount { get; private set; }

        public int ContextIndex { get; private set; } = int.MinValue;

        public void Append(ReadOnlySpan<double> run)
        {
            if (PendingCount + run.Length > Pending.Length)
            {
                var grown = new double[Math.Max(2 * Pending.Length, PendingCount + run.Length)];
                Pending.AsSpan(0, PendingCount).CopyTo(grown);
                Pending = grown;
            }
            run.CopyTo(Pending.AsSpan(PendingCount));
            PendingCount += run.Length;
        }

        /// <summary>Median range of the recent blocks, or null while fewer than <see cref="MinHistory"/> are known.</summary>
        public double? ReferenceRange()
        {
            if (_rangeCount < MinHistory)
            {
                return null;
            }
            Array.Copy(_ranges, _sorted, _rangeCount);
            Array.Sort(_sorted, 0, _rangeCount);
            return _sorted[_rangeCount / 2];
        }

        public void NoteRange(double range)
        {
            _ranges[_rangeNext] = range;
            _rangeNext = (_rangeNext + 1) % History;
            _rangeCount = Math.Min(History, _rangeCount + 1);
        }

        public void KeepContext(int index, ReadOnlySpan<double> block, int halfWindow)
        {
            if (Context.Length < halfWindow)
            {
                Context = new double[halfWindow];
            }
            var kept = Math.Min(halfWindow, block.Length);
            block[^kept..].CopyTo(Context);
            ContextCount = kept;
            ContextIndex = index;
        }

        /// <summary>Finite samples of the block waiting for its right context; 0 when none waits.</summary>
        public int WaitingCount { get; set; }

        public int WaitingIndex { get; private set; }

        private int _waitingBefore;
        private int _waitingLength;

        /// <summary>Holds a block (with the previous block's last samples when it is its neighbour) for Hampel.</summary>
        public void Wait(int index, ReadOnlySpan<double> block, int finite, int halfWindow)
        {
            var before = ContextIndex == index - 1 ? ContextCount : 0;
            var x = Scratch(before + block.Length + halfWindow);
            Context.AsSpan(0, before).CopyTo(x);
            block.CopyTo(x.AsSpan(before));
            _waitingBefore = before;
            _waitingLength = block.Length;
            WaitingIndex = index;
            WaitingCount = finite;
        }

        /// <summary>The waiting block's Hampel input: left context, the block, <paramref name="right"/>.</summary>
        public (double[] X, int Total, int Before, int Length) WaitingWith(ReadOnlySpan<double> right)
        {
            var x = Scratch(_waitingBefore + _waitingLength + right.Length);
            right.CopyTo(x.AsSpan(_waitingBefore + _waitingLength));
            return (x, _waitingBefore + _waitingLength + right.Length, _waitingBefore, _waitingLength);
        }

        public double[] Scratch(int length)
        {
            if (_scratch.Length < length)
            {
                var grown = new double[Math.Max(length, 2 * _scratch.Length)];
                _scratch.CopyTo(grown, 0); // a waiting block keeps its samples
                _scratch = grown;
            }
            return _scratch;
        }
    }
}
