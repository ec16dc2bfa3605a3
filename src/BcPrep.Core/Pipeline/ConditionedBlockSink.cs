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

    /// <summary>Passes on the rows every channel has finished (all channels of a logger share one time axis).</summary>
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
                throw new InvalidOperationException($"conditioned time axes of '{channels[0]}' and '{channels[c]}' differ");
            }
        }
        // The rows go out in arrays kept from block to block (a sink reads a block and keeps none of it, as with
        // the reader's blocks).
        var rows = Math.Min(ready, RowsPerBlock);
        if (_times.Length < rows)
        {
            _times = new double[Math.Max(rows, Math.Min(RowsPerBlock, _times.Length * 2))];
            _values = new double[channels.Count][];
        }
        if (_values.Length != channels.Count)
        {
            _values = new double[channels.Count][];
        }
        for (var from = 0; from < ready; from += RowsPerBlock)
        {
            var n = Math.Min(RowsPerBlock, ready - from);
            first.CopyOutputTimes(_times.AsSpan(0, n));
            for (var c = 0; c < channels.Count; c++)
            {
                var s = _conditioners[channels[c]];
                if (_values[c] is null || _values[c].Length < _times.Length)
                {
                    _values[c] = new double[_times.Length];
                }
                CollectionsMarshal.AsSpan(s.OutputValues).Slice(from, n).CopyTo(_values[c]);
                s.DropOutputTimes(n);
            }
            inner.AcceptBlock(channels, _times, _values, n);
        }
        foreach (var id in channels)
        {
            _conditioners[id].OutputValues.RemoveRange(0, ready);
        }
    }
}
