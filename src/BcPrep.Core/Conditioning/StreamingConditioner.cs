using System.Runtime.InteropServices;

namespace BcPrep.Conditioning;

/// <summary>
/// The conditioning chain of <see cref="ChannelConditioner.Condition"/> applied to a channel of any length with
/// bounded memory. Samples are conditioned in chunks of <c>coreLength</c> samples, each with
/// <see cref="Overlap"/> samples of context on both sides that are conditioned but not emitted. The overlap covers
/// the longest bridged gap, the Hampel window and the filters' settling to a 1e-14 residual, so chunk seams do
/// not show: the output equals the whole-record result to rounding (tested to 1e-9). Memory: about
/// coreLength + 2·overlap samples plus the output not yet taken.
/// </summary>
public sealed class StreamingConditioner
{
    /// <summary>Residual of a filter transient at the end of the overlap (relative to the step that caused it).</summary>
    public const double SeamResidual = 1e-14;

    private readonly ConditioningSettings _settings;
    private readonly int _coreOverlaps;
    private int _coreLength;
    private readonly List<double> _t = [];
    private readonly List<double> _x = [];
    private int _history;

    /// <param name="settings">Conditioning settings (validated when the first chunk is conditioned).</param>
    /// <param name="coreLength">Samples emitted per chunk (≥ 16; raised to the overlap when that is longer).</param>
    /// <param name="coreOverlaps">
    /// The chunk's core is also at least this many overlaps long (≥ 1). Every chunk filters its overlap on both sides
    /// again, so a core of k overlaps costs (k + 2) / k times the samples it emits: 3 for k = 1, 1.5 for k = 4.
    /// Memory grows with k; the output does not change beyond rounding (the seams move).
    /// </param>
    public StreamingConditioner(ConditioningSettings settings, int coreLength = 65536, int coreOverlaps = 1)
    {
        ArgumentNullException.ThrowIfNull(settings);
        if (coreLength < 16)
        {
            throw new ArgumentOutOfRangeException(nameof(coreLength), coreLength, "A chunk holds at least 16 samples.");
        }
        ArgumentOutOfRangeException.ThrowIfLessThan(coreOverlaps, 1);
        _settings = settings;
        _coreLength = coreLength;
        _coreOverlaps = coreOverlaps;
    }

    /// <summary>Context samples on each side of a chunk; 0 until the sample interval is known (first chunk).</summary>
    public int Overlap { get; private set; }

    /// <summary>Conditioned times (s) not yet taken by the caller.</summary>
    public List<double> OutputTimesS { get; } = [];

    /// <summary>Conditioned values not yet taken by the caller (NaN where a gap stays open or a segment was too short).</summary>
    public List<double> OutputValues { get; } = [];

    /// <summary>Samples replaced by the Hampel filter so far (emitted samples only).</summary>
    public long SpikesReplaced { get; private set; }

    /// <summary>Samples filled in by gap bridging so far (emitted samples only).</summary>
    public long BridgedSamples { get; private set; }

    /// <summary>Notch frequencies applied (from the first chunk; empty when mains is off or above Nyquist).</summary>
    public IReadOnlyList<double> NotchFrequenciesHz { get; private set; } = [];

    /// <summary>Appends samples (times strictly increasing across calls) and conditions every full chunk.</summary>
    public void Push(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values)
    {
        if (timesS.Length != values.Length)
        {
            throw new ArgumentException("Times and values must have the same length.", nameof(values));
        }
        _t.AddRange(timesS);
        _x.AddRange(values);
        if (Overlap == 0 && _t.Count >= 64)
        {
            Overlap = OverlapFor(_t);
            // The kept context must lie inside what was emitted, and a long core amortises the repeated overlaps.
            _coreLength = Math.Max(_coreLength, _coreOverlaps * Overlap);
        }
        while (Overlap > 0 && _t.Count - _history >= _coreLength + Overlap)
        {
            ConditionChunk(_history + _coreLength + Overlap, _t[_history + _coreLength]);
        }
    }

    /// <summary>Conditions what is left; call once after the last <see cref="Push"/>.</summary>
    public void Complete()
    {
        if (_t.Count - _history <= 0)
        {
            return;
        }
        if (_t.Count < 2)
        {
            OutputTimesS.AddRange(_t);
            OutputValues.AddRange(_x);
            _t.Clear();
            _x.Clear();
            return;
        }
        ConditionChunk(_t.Count, double.PositiveInfinity);
        _t.Clear();
        _x.Clear();
        _history = 0;
    }

    private void ConditionChunk(int end, double emitBeforeS)
    {
        var times = CollectionsMarshal.AsSpan(_t)[..end].ToArray();
        var result = ChannelConditioner.Condition(times, CollectionsMarshal.AsSpan(_x)[..end].ToArray(), _settings);
        NotchFrequenciesHz = result.Report.NotchFrequenciesHz;
        var emitFromS = _history > 0 ? _t[_history] : double.NegativeInfinity;
        var spikes = new HashSet<double>(result.Report.SpikeTimesS);
        for (var i = 0; i < result.TimesS.Length; i++)
        {
            var t = result.TimesS[i];
            if (t >= emitFromS && t < emitBeforeS)
            {
                OutputTimesS.Add(t);
                OutputValues.Add(result.Values[i]);
                BridgedSamples += result.Interpolated[i] ? 1 : 0;
                SpikesReplaced += spikes.Contains(t) ? 1 : 0;
            }
        }
        if (double.IsPositiveInfinity(emitBeforeS))
        {
            return;
        }
        // Keep `Overlap` already emitted samples as the left context of the next chunk.
        var drop = _history + _coreLength - Overlap;
        _t.RemoveRange(0, drop);
        _x.RemoveRange(0, drop);
        _history = Overlap;
    }

    private int OverlapFor(List<double> times)
    {
        var steps = new double[times.Count - 1];
        for (var i = 1; i < times.Count; i++)
        {
            steps[i - 1] = times[i] - times[i - 1];
        }
        Array.Sort(steps);
        var nominal = steps[steps.Length / 2];
        var fs = 1.0 / nominal;
        var sections = new List<SecondOrderSection>();
        if (_settings.MainsHz is double mains && mains < fs / 2.0)
        {
            sections.AddRange(MainsNotch.WithHarmonics(mains, _settings.NotchQ, _settings.NotchHarmonics, fs).Sections);
        }
        if (_settings.LowPassCutoffHz is double cutoff)
        {
            sections.AddRange(ButterworthDesign.LowPass(_settings.LowPassOrder, cutoff, fs).Sections);
        }
        // Twice the settling length: each section's edge states (Gustafsson) start a transient that the sections
        // after it carry on, so one decay length of the slowest pole is not quite enough for the whole cascade.
        var settle = sections.Count > 0 ? 2 * ZeroPhaseFilter.SettlingPadLength(sections, SeamResidual) : 0;
        var bridge = (int)Math.Ceiling(_settings.MaxBridgeS / nominal);
        return settle + (2 * bridge) + (4 * _settings.HampelHalfWindow) + 16;
    }
}
