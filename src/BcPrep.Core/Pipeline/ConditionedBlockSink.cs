using System.Globalization;
using System.Runtime.InteropServices;
using BcPrep.Conditioning;
using BcPrep.Rig;

namespace BcPrep.Pipeline;

/// <summary>
/// Conditions calibrated row blocks channel by channel (<see cref="StreamingConditioner"/>, settings from the rig
/// file; the channels in parallel when asked) and passes conditioned rows on to another block sink. Rows leave with a delay of
/// about a chunk and each filter section's stretch; call <see cref="Complete"/> after the last block. A new logger
/// (another channel list) completes the previous one. Memory per channel: a chunk plus its context and a stretch per
/// filter section, whatever the length of the day. A chunk's core is at least <see cref="CoreOverlaps"/> of its
/// overlaps long, and a filter section's backward stretch at least that many of its settling lengths (at 1 kHz a
/// 0.5 Hz low-pass settles over about 27 000 samples), so repeated context costs at most a quarter of the samples emitted.
/// The logger's times are kept once (<see cref="SlidingDoubles"/>) and read by every channel's conditioner, which
/// carries positions on them rather than a copy; the rows' times are copied from them once per block.
/// </summary>
/// <param name="rig">The rig: each channel's conditioning settings.</param>
/// <param name="inner">Receives the conditioned rows.</param>
/// <param name="coreLength">Samples of a chunk's core.</param>
/// <param name="parallelChannels">
/// Condition the channels of a block on every core: worth it for the full-rate chain of <c>calibrate --conditioned</c>,
/// which costs more than parsing the day. Off for <c>process</c>, whose chain runs on sub-block means beside the
/// parser, the window statistics and the hashing: there the cores are busy and the hand-over per block costs more
/// than the work.
/// </param>
public sealed class ConditionedBlockSink(RigDescription rig, IBlockSink inner, int coreLength = 65536, bool parallelChannels = false) : IBlockSink
{
    /// <summary>A chunk's core is at least this many overlaps long (<see cref="StreamingConditioner"/>).</summary>
    public const int CoreOverlaps = 4;

    private readonly Dictionary<string, StreamingConditioner> _conditioners = new(StringComparer.Ordinal);
    private IReadOnlyList<string>? _channels;
    private SlidingDoubles _axis = new();
    private double[] _times = [];
    private double[][] _values = [];

    /// <summary>Per channel (all loggers so far): samples replaced by the Hampel filter and samples bridged.</summary>
    public IReadOnlyDictionary<string, (long Spikes, long Bridged, IReadOnlyList<double> NotchesHz)> Totals => _totals;

    private readonly Dictionary<string, (long Spikes, long Bridged, IReadOnlyList<double> NotchesHz)> _totals = new(StringComparer.Ordinal);

    public void AcceptBlock(IReadOnlyList<string> channels, double[] timeS, IReadOnlyList<double[]> valuesSi, int count)
    {
        ArgumentNullException.ThrowIfNull(channels);
        ArgumentNullException.ThrowIfNull(valuesSi);
        if (_channels is not null && !_channels.SequenceEqual(channels))
        {
            Complete();
        }
        if (_channels is null)
        {
            _channels = channels.ToList();
            _axis = new SlidingDoubles();
            _lastRowS = double.NaN;
            _lastChannelS = new double[channels.Count];
            Array.Fill(_lastChannelS, double.NaN);
            foreach (var id in channels)
            {
                var spec = rig.Channel(id) ?? throw new InvalidOperationException($"channel '{id}' is not in the rig description");
                _conditioners[id] = new StreamingConditioner(ChannelConditioningPlan.Settings(rig, spec), coreLength, CoreOverlaps, _axis) { DeferFilters = parallelChannels };
            }
        }
        var conditioners = channels.Select(id => _conditioners[id]).ToArray();
        _axis.Append(timeS.AsSpan(0, count));
        ForEachChannel(conditioners.Length, c => conditioners[c].PushValues(valuesSi[c].AsSpan(0, count)));
        FilterPending(conditioners);
        Drain();
        _axis.DropBefore(conditioners.Min(c => c.OldestTimeNeeded));
    }

    /// <summary>Conditions and passes on what is left of the current logger.</summary>
    public void Complete()
    {
        if (_channels is null)
        {
            return;
        }
        var conditioners = _channels.Select(id => _conditioners[id]).ToArray();
        if (parallelChannels)
        {
            ForEachChannel(conditioners.Length, c => conditioners[c].CompleteChunks());
            FilterPending(conditioners);
            ForEachChannel(conditioners.Length, c => conditioners[c].CompleteFilters());
        }
        else
        {
            ForEachChannel(conditioners.Length, c => conditioners[c].Complete());
        }
        Drain();
        foreach (var id in _channels)
        {
            var s = _conditioners[id];
            _totals[id] = (s.SpikesReplaced, s.BridgedSamples, s.NotchFrequenciesHz);
        }
        _conditioners.Clear();
        _channels = null;
    }

    /// <summary>
    /// With the channels in parallel, their notch and low-pass inputs wait (<see cref="StreamingConditioner.DeferFilters"/>)
    /// and are filtered four channels at a time, in the lanes of one vector (the same values as one at a time).
    /// </summary>
    private void FilterPending(StreamingConditioner[] conditioners)
    {
        if (!parallelChannels)
        {
            return;
        }
        var lanes = StreamedSectionPass.Lanes;
        var groups = (conditioners.Length + lanes - 1) / lanes;
        Parallel.For(0, groups, g => StreamingConditioner.AcceptPending(conditioners.AsSpan(g * lanes, Math.Min(lanes, conditioners.Length - (g * lanes))).ToArray()));
    }

    /// <summary>Channels are conditioned independently: in parallel when asked, else in order on this thread.</summary>
    private void ForEachChannel(int count, Action<int> condition)
    {
        if (parallelChannels)
        {
            Parallel.For(0, count, condition);
            return;
        }
        for (var c = 0; c < count; c++)
        {
            condition(c);
        }
    }

    /// <summary>Rows passed on per call at most: the filters emit a stretch of every channel at once (about 130 000
    /// rows at 1 kHz, more at a segment's end), and arrays as long as the longest of those were larger than the rows
    /// need (their pages first touched, which costs more than copying into them). A sink reads rows in order, so
    /// how they are cut into blocks changes nothing it writes.</summary>
    internal const int RowsPerBlock = 65536;

    /// <summary>
    /// Passes on the rows every channel has finished. The channels of a logger share one time axis, and nearly always
    /// their conditioned times too; where gap bridging inserted samples into a time jump in some channels and left the
    /// gap open in another (its cells were empty beside the jump, so its gap is longer than the bridge), the rows
    /// are the union of their times and that channel's cells in the inserted rows are NaN (written empty), as the
    /// cells of a gap left open are (<see cref="DrainMerged"/>).
    /// </summary>
    private void Drain()
    {
        var channels = _channels!;
        var ready = channels.Min(id => _conditioners[id].OutputValues.Count);
        if (ready == 0)
        {
            return;
        }
        var first = _conditioners[channels[0]];
        for (var c = 1; c < channels.Count; c++)
        {
            // Only a channel with samples inserted by gap bridging has times of its own to compare; the others sit
            // at the same positions of the shared axis as the first channel.
            if (!_conditioners[channels[c]].SameOutputTimes(first, ready))
            {
                DrainMerged();
                return;
            }
        }
        // The rows go out in arrays kept from block to block (a sink reads a block and keeps none of it, as with
        // the reader's blocks).
        RowArrays(Math.Min(ready, RowsPerBlock), channels.Count);
        for (var from = 0; from < ready; from += RowsPerBlock)
        {
            var n = Math.Min(RowsPerBlock, ready - from);
            first.CopyOutputTimes(_times.AsSpan(0, n));
            for (var c = 0; c < channels.Count; c++)
            {
                var s = _conditioners[channels[c]];
                CollectionsMarshal.AsSpan(s.OutputValues).Slice(from, n).CopyTo(_values[c]);
                s.DropOutputTimes(n);
            }
            inner.AcceptBlock(channels, _times, _values, n);
            _lastRowS = _times[n - 1];
        }
        foreach (var id in channels)
        {
            _conditioners[id].OutputValues.RemoveRange(0, ready);
        }
        Array.Fill(_lastChannelS, _lastRowS);
    }

    /// <summary>The time of the last row passed on for the current logger (NaN before its first).</summary>
    private double _lastRowS = double.NaN;

    /// <summary>Per channel of the current logger, the time of its last value passed on (NaN before its first).</summary>
    private double[] _lastChannelS = [];

    /// <summary>Row arrays for at least <paramref name="rows"/> rows of <paramref name="channelCount"/> channels, kept from block to block.</summary>
    private void RowArrays(int rows, int channelCount)
    {
        if (_times.Length < rows)
        {
            _times = new double[Math.Max(rows, Math.Min(RowsPerBlock, _times.Length * 2))];
            _values = new double[channelCount][];
        }
        if (_values.Length != channelCount)
        {
            _values = new double[channelCount][];
        }
        for (var c = 0; c < channelCount; c++)
        {
            if (_values[c] is null || _values[c].Length < _times.Length)
            {
                _values[c] = new double[_times.Length];
            }
        }
    }

    /// <summary>
    /// Passes on, in time order, every row up to the earliest of the channels' last finished times (a channel emits
    /// its times in increasing order, so no channel can still add a row before it): one row per time of any channel,
    /// each channel's value where it has that time, else NaN. A channel may lack a row's time only inside a time
    /// jump of its own series (a gap it left open where another channel inserted samples); anything else would be
    /// channels out of step, which is refused rather than written out of line.
    /// </summary>
    private void DrainMerged()
    {
        var channels = _channels!;
        var conditioners = channels.Select(id => _conditioners[id]).ToArray();
        var times = new double[conditioners.Length][];
        var taken = new int[conditioners.Length];
        var untilS = double.PositiveInfinity;
        var total = 0;
        for (var c = 0; c < conditioners.Length; c++)
        {
            var count = conditioners[c].OutputValues.Count;
            times[c] = new double[count];
            conditioners[c].CopyOutputTimes(times[c]);
            untilS = Math.Min(untilS, times[c][count - 1]);
            total += count;
        }
        RowArrays(Math.Min(total, RowsPerBlock), conditioners.Length);
        var n = 0;
        while (true)
        {
            var rowS = double.PositiveInfinity;
            for (var c = 0; c < conditioners.Length; c++)
            {
                if (taken[c] < times[c].Length)
                {
                    rowS = Math.Min(rowS, times[c][taken[c]]);
                }
            }
            if (!(rowS <= untilS))
            {
                break;
            }
            for (var c = 0; c < conditioners.Length; c++)
            {
                var i = taken[c];
                if (times[c][i] == rowS)
                {
                    _values[c][n] = conditioners[c].OutputValues[i];
                    taken[c]++;
                    continue;
                }
                // Not this channel's time: it must lie inside a time jump of its own series, a step longer than a
                // jump (GapBridging.JumpFactor) of the rows' step into this row.
                var beforeS = i > 0 ? times[c][i - 1] : _lastChannelS[c];
                var rowStepS = rowS - (n > 0 ? _times[n - 1] : _lastRowS);
                if (!(times[c][i] - beforeS > GapBridging.JumpFactor * rowStepS))
                {
                    throw new InvalidOperationException(string.Create(CultureInfo.InvariantCulture,
                        $"conditioned time axes of '{channels[0]}' and '{channels[c]}' differ: '{channels[c]}' has no sample at {rowS:R} s but no time jump there ({beforeS:R} s, {times[c][i]:R} s)"));
                }
                _values[c][n] = double.NaN;
            }
            _times[n++] = rowS;
            if (n == _times.Length)
            {
                PassOn(channels, n);
                n = 0;
            }
        }
        if (n > 0)
        {
            PassOn(channels, n);
        }
        for (var c = 0; c < conditioners.Length; c++)
        {
            if (taken[c] > 0)
            {
                _lastChannelS[c] = times[c][taken[c] - 1];
            }
            conditioners[c].DropOutputTimes(taken[c]);
            conditioners[c].OutputValues.RemoveRange(0, taken[c]);
        }
    }

    private void PassOn(IReadOnlyList<string> channels, int n)
    {
        inner.AcceptBlock(channels, _times, _values, n);
        _lastRowS = _times[n - 1];
    }
}
