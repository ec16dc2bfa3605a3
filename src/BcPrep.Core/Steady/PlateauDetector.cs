using static BcPrep.Steady.WindowCriteria;

namespace BcPrep.Steady;

/// <summary>
/// Finds operating points as plateaus between set-point steps, each averaged from the moment it is settled to its
/// end. This replaces sliding a test window with a drift limit, which flickers around its limit on autocorrelated
/// noise (one plateau, several points), cannot tell a settled channel from one still approaching its asymptote
/// slowly, and needs hand-written limits.
/// <list type="number">
/// <item>Spikes are removed from the block means (<see cref="BlockDespike"/>); gaps stay NaN and are skipped by
/// every later step, so they neither split nor extend a plateau.</item>
/// <item>Steps are found on the key channels and on the step-only channels (<see cref="StepFinder"/>), each with
/// the larger of its own step threshold and 16 noise standard deviations of a 10-block mean difference (and, on
/// a key, twice its tolerance: a change inside the tolerance is no new point). A plateau runs from one step to
/// the block before the next.</item>
/// <item>On each plateau every key channel's first-order approach is fitted (<see cref="SettlingEstimate"/>).
/// The channel is settled from the moment its predicted remaining change, |slope|·τ, is within its tolerance.
/// The fit is repeated on the tail, from where 20 tolerances are left, so that the slowest time constant decides.
/// Where the fit does not describe the data (residual beyond 4 noise standard deviations and beyond the
/// tolerance), MSER-5 truncation of the plateau stands in for it.</item>
/// <item>The window runs from the last key channel's settled moment to the plateau's end, less trailing blocks
/// that already left the level (a step that begins inside a block). It is accepted when the plateau lasts at least
/// the minimum duration, the settled part at least one test window, its means are above the channels' minimum and
/// its scatter within any scatter limit.</item>
/// <item>No flicker: two accepted windows of neighbouring plateaus merge into one point when the later one was
/// settled from its first block (there was no approach, so the step between them was noise) and every key
/// channel's means agree within the step threshold. A real set-point step is followed by an approach, or it
/// moves a mean beyond its threshold, so it still splits.</item>
/// </list>
/// </summary>
public static class PlateauDetector
{
    /// <summary>Blocks on each side of the step finder's mean difference, in seconds of blocks.</summary>
    public const double StepHalfWindowS = 10.0;

    /// <summary>Step threshold in noise standard deviations of one block mean, before the √(2/h) of the difference.</summary>
    public const double StepNoiseSigmas = 16.0;

    /// <summary>
    /// The settled moment is taken where the fitted curve comes within this fraction of the tolerance: a tenth is
    /// kept in reserve for the error of the fitted τ (about τ/10 later, e.g. 30–60 s on a wall of τ = 5–10 min).
    /// </summary>
    public const double SettlingMargin = 0.9;

    /// <summary>The approach is fitted again from where the first fit leaves this many tolerances to go.</summary>
    public const double RefitFactor = 20.0;

    /// <summary>Detects the operating points of a whole day of block means (times in s, one block apart).</summary>
    /// <param name="timesS">Block centre times, s.</param>
    /// <param name="channels">Key and step-marker channels with their block means.</param>
    /// <param name="settings">Detection settings.</param>
    /// <param name="blockS">Block width, s; null to take it from the first two times (at least two blocks).</param>
    public static SteadyDetectionResult Detect(IReadOnlyList<double> timesS, IReadOnlyList<KeyChannel> channels, SteadySettings settings, double? blockS = null)
    {
        ArgumentNullException.ThrowIfNull(timesS);
        ArgumentNullException.ThrowIfNull(channels);
        ArgumentNullException.ThrowIfNull(settings);
        foreach (var channel in channels)
        {
            if (channel.Values.Count != timesS.Count)
            {
                throw new ArgumentException(Format($"channel '{channel.Name}' has {channel.Values.Count} values for {timesS.Count} times."), nameof(channels));
            }
        }
        var scan = new PlateauScan(channels, settings, blockS ?? (timesS.Count > 1 ? timesS[1] - timesS[0] : 1.0));
        var row = new double[channels.Count];
        for (var i = 0; i < timesS.Count; i++)
        {
            for (var c = 0; c < channels.Count; c++)
            {
                row[c] = channels[c].Values[i];
            }
            scan.Append(timesS[i], row);
        }
        return scan.Finish();
    }

    /// <summary>What became of one plateau: its window (and whether it was settled from its first block), or why not.</summary>
    internal sealed record PlateauOutcome(SteadyWindow? Accepted, bool Immediate, RejectedStretch? Rejected);

    /// <summary>
    /// Judges the plateau of blocks [first, last]: settling fit of each key channel, the window from the last
    /// settled moment to the plateau's end (less a trailing departure), then duration, scatter, range and coverage.
    /// Reads the blocks of the plateau only, and <paramref name="noise"/> (per channel, of the day up to the plateau's end).
    /// </summary>
    internal static PlateauOutcome Judge(double[] t, double[][] clean, IReadOnlyList<KeyChannel> channels, int[] keys, SteadySettings settings, double block,
        double[] noise, int first, int last)
    {
        var startS = t[first] - (block / 2);
        var endS = t[last] + (block / 2);
        var criteria = new List<ChannelCriteria>();
        var settledS = startS;
        var notSettled = new List<string>();
        foreach (var c in keys)
        {
            var (since, fitted, remainingAtEnd, tolerance) = Settle(t, clean[c], channels[c], settings, noise[c], first, last, startS, block);
            settledS = Math.Max(settledS, since);
            if (remainingAtEnd > tolerance)
            {
                notSettled.Add(Format($"{channels[c].Name}: predicted remaining change {remainingAtEnd:G3} > tolerance {tolerance:G3} at the plateau's end (τ = {fitted?.TauS ?? double.NaN:F0} s)"));
            }
            criteria.Add(new ChannelCriteria(channels[c].Name, double.NaN, double.NaN, double.NaN, double.NaN, channels[c].DriftLimitPerS, double.NaN,
                channels[c].ScatterLimit, double.NaN, double.NaN, double.NaN, [])
            {
                TauS = fitted?.TauS ?? double.NaN, Tolerance = tolerance, SettledSinceS = since,
                // What the fitted curve still travels from the settled moment to the plateau's end: the quantity
                // the tolerance is held against (with a drift, not quite the distance to the asymptote).
                RemainingChange = fitted is null || !double.IsFinite(since) ? double.NaN
                    : Math.Abs(fitted.ValueAt(Math.Max(since, startS)) - fitted.ValueAt(endS)),
            });
        }
        var from = first;
        while (from <= last && t[from] - (block / 2) < settledS - 1e-9)
        {
            from++;
        }
        var keyClean = keys.Select(c => clean[c]).ToArray();
        var to = from < last ? TrimTrailingDeparture(t, keyClean, from, last, settings) : last;
        var settledFor = from > last ? 0 : t[to] + (block / 2) - (t[from] - (block / 2));
        if (notSettled.Count > 0 || from > last || endS - startS < settings.MinStretchS || settledFor < settings.WindowS)
        {
            var reason = notSettled.Count > 0
                ? "still settling: " + string.Join("; ", notSettled)
                : endS - startS < settings.MinStretchS
                    ? Format($"{SteadyCriterion.Duration}: plateau of {endS - startS:F0} s, shorter than the minimum {settings.MinStretchS} s")
                    : Format($"{SteadyCriterion.Duration}: settled for {settledFor:F0} s (from {settledS:F0} s), shorter than the test window {settings.WindowS} s");
            return new PlateauOutcome(null, false, new RejectedStretch(startS, endS, Math.Min(settledS, endS), endS, reason, criteria));
        }
        var winStart = t[from] - (block / 2);
        var winEnd = t[to] + (block / 2);
        var evaluated = new List<ChannelCriteria>();
        var failures = new List<CriterionFailure>();
        for (var k = 0; k < keys.Length; k++)
        {
            var c = keys[k];
            var (dc, _) = DriftScatter(t, clean[c], channels[c], settings, from, to);
            // The drift rule is replaced by the settling estimate; scatter, range and coverage still apply.
            var kept = dc.Failures.Where(f => f.Criterion is SteadyCriterion.Scatter or SteadyCriterion.Range or SteadyCriterion.Coverage).ToList();
            failures.AddRange(kept);
            var fit = criteria[k];
            evaluated.Add(dc with
            {
                Failures = kept, TauS = fit.TauS, Tolerance = fit.Tolerance, SettledSinceS = fit.SettledSinceS,
                RemainingChange = fit.RemainingChange,
            });
        }
        if (failures.Count > 0)
        {
            return new PlateauOutcome(null, false, new RejectedStretch(startS, endS, winStart, winEnd,
                "closest window still failed: " + string.Join("; ", failures.Select(f => f.Description)), evaluated));
        }
        return new PlateauOutcome(new SteadyWindow(winStart, winEnd, startS, endS, SteadyMethod.DriftScatter | SteadyMethod.Settling, evaluated), from == first, null);
    }

    /// <summary>Whether every key channel's means of two windows agree within its step threshold.</summary>
    internal static bool SameLevel(SteadyWindow a, SteadyWindow b, int[] keys, double[] thresholds)
    {
        for (var k = 0; k < keys.Length; k++)
        {
            if (!(Math.Abs(a.Channels[k].Mean - b.Channels[k].Mean) <= thresholds[keys[k]]))
            {
                return false;
            }
        }
        return true;
    }

    /// <summary>
    /// A channel's step threshold: the larger of 16 noise standard deviations of a mean difference, twice a key's
    /// tolerance at its level (a hundredth of the level on a step marker), and the threshold written in the rig file.
    /// </summary>
    internal static double StepThreshold(KeyChannel channel, double level, double noise, int half)
    {
        var fromNoise = StepNoiseSigmas * noise * Math.Sqrt(2.0 / half);
        var floor = channel.StepOnly ? 0.01 * level : channel.Tolerance is { } tolerance ? 2.0 * tolerance(level) : 0.0;
        var threshold = Math.Max(fromNoise, floor);
        if (double.IsFinite(channel.StepThreshold))
        {
            threshold = Math.Max(threshold, channel.StepThreshold);
        }
        return threshold > 0 ? threshold : double.Epsilon;
    }

    private static (double SettledS, SettlingFit? Fit, double RemainingAtEnd, double Tolerance) Settle(double[] t, double[] y, KeyChannel channel, SteadySettings settings,
        double noise, int first, int last, double startS, double block)
    {
        var span = t.AsSpan(first, last - first + 1);
        var values = y.AsSpan(first, last - first + 1);
        var finite = 0;
        var sum = 0.0;
        foreach (var v in values)
        {
            if (double.IsFinite(v))
            {
                finite++;
                sum += v;
            }
        }
        var tolerance = channel.Tolerance?.Invoke(finite > 0 ? sum / finite : 0.0) ?? (channel.DriftLimitPerS * settings.WindowS);
        if (finite < 8)
        {
            return (double.PositiveInfinity, null, double.PositiveInfinity, tolerance);
        }
        var fit = SettlingEstimate.Fit(span, values, startS, block, Math.Max(4 * (t[last] - startS), 10 * block), withDrift: true);
        var endS = t[last] + (block / 2);
        if ((fit.TauAtBound || fit.TauS > endS - startS) && fit.TauS > block * 2)
        {
            // τ at the long end: the data show no approach, only (at most) a straight drift, which the exponential
            // and the drift term then share between them. A drift that stays within the tolerance over the
            // plateau is settled from its start; a larger one is a ramp, never settled. So also when τ exceeds the
            // plateau: less than one time constant is in view, the curve and the drift cannot be told apart, and
            // on a settled plateau of autocorrelated noise the fit finds such a curve (τ twice the plateau) whose
            // |slope|·τ is noise amplified by τ. A real approach that slow drifts beyond the tolerance: a ramp.
            var line = SettlingEstimate.Fit(span, values, startS, block, 2 * block, withDrift: true);
            var change = Math.Abs(line.DriftPerS) * (endS - startS);
            var straight = line with { Amplitude = 0.0 };
            return change <= tolerance ? (startS, straight, 0.0, tolerance) : (double.PositiveInfinity, straight, change, tolerance);
        }
        // A real wall follows the outlet, which follows the step: more than one time constant. The tail, where the
        // slowest one alone is left, decides when it settles, so the approach is fitted again from where the first
        // fit leaves RefitFactor tolerances to go (an exponential restarted anywhere is still the same exponential).
        var refitFromS = fit.SettledSinceS(RefitFactor * tolerance, endS);
        if (refitFromS > startS && endS - refitFromS >= 20 * block)
        {
            var from = first;
            while (from < last && t[from] < refitFromS)
            {
                from++;
            }
            var tail = SettlingEstimate.Fit(t.AsSpan(from, last - from + 1), y.AsSpan(from, last - from + 1), refitFromS, block,
                Math.Max(4 * (t[last] - startS), 10 * block), withDrift: true);
            if (!tail.TauAtBound)
            {
                fit = tail;
            }
        }
        if (fit.ResidualStandardDeviation <= Math.Max(4 * noise, tolerance))
        {
            return (fit.SettledSinceS(SettlingMargin * tolerance, endS), fit, fit.RemainingChangeAt(endS), tolerance);
        }
        // Not a first-order approach (an undetected step, a ramp): MSER-5 on the plateau decides where it settled.
        var filled = FillGaps(values);
        var mser = Mser.Truncate(filled, settings.MserBatchSize);
        return (t[first + mser.TruncationSamples] - (block / 2), fit, mser.InsideFirstHalf ? 0.0 : double.PositiveInfinity, tolerance);
    }

    private static double[] FillGaps(ReadOnlySpan<double> values)
    {
        var filled = values.ToArray();
        var last = double.NaN;
        for (var i = 0; i < filled.Length; i++)
        {
            if (double.IsFinite(filled[i]))
            {
                last = filled[i];
            }
            else
            {
                filled[i] = last;
            }
        }
        var next = double.NaN;
        for (var i = filled.Length - 1; i >= 0; i--)
        {
            if (double.IsFinite(filled[i]))
            {
                next = filled[i];
            }
            else
            {
                filled[i] = next;
            }
        }
        return filled;
    }

    /// <summary>Median of the absolute finite values: a channel's level.</summary>
    internal static double MedianAbs(IReadOnlyList<double> values) => MedianAbs((values as double[] ?? [.. values]).AsSpan());

    /// <inheritdoc cref="MedianAbs(IReadOnlyList{double})"/>
    internal static double MedianAbs(ReadOnlySpan<double> values)
    {
        var finite = new double[values.Length];
        var count = 0;
        foreach (var v in values)
        {
            if (double.IsFinite(v))
            {
                finite[count++] = Math.Abs(v);
            }
        }
        return count == 0 ? 0.0 : BlockDespike.Median(finite.AsSpan(0, count));
    }

    /// <summary>The 99th percentile of the absolute finite values: a channel's largest level, robust to a stray block.</summary>
    internal static double Percentile99(IReadOnlyList<double> values)
    {
        var finite = values.Where(double.IsFinite).Select(Math.Abs).Order().ToArray();
        return finite.Length == 0 ? 0.0 : finite[(int)Math.Floor(0.99 * (finite.Length - 1))];
    }
}
