using System.Globalization;

namespace BcPrep.Steady;

/// <summary>Finds steady operating points in block-mean time series of several key channels.</summary>
public static class SteadyStateDetector
{
    /// <summary>
    /// 1. A test window of WindowS slides in StepS steps. Per channel: OLS slope b ± u(b) (<see cref="TrendFit"/>) and
    ///    standard deviation s. Drift rule: |b| + k·u(b) ≤ DriftLimitPerS (k = DriftCoverageFactor) — the slope must be
    ///    shown to be inside its limit, not merely estimated inside it; scatter rule: s ≤ ScatterLimit. A window is
    ///    steady when every channel passes both and has ≥ MinFiniteFraction finite samples.
    /// 2. Consecutive steady windows merge into a stretch; a stretch is cut where, for any channel, the mean of the
    ///    WindowS/2 samples after a point differs from the mean of those before by more than StepThreshold
    ///    (set-point change; cut at the largest difference).
    /// 3. Stretches shorter than MinStretchS are rejected. Otherwise the averaging window is the last TailS seconds;
    ///    drift/scatter are re-evaluated on it, R is taken at its end (filters run from the stretch start) and
    ///    MSER-5 is run on the stretch. Accepted when all RequiredMethods pass.
    /// 4. Runs of non-steady windows are rejected, reporting the window closest to passing (smallest worst ratio of
    ///    value to limit) with each failed criterion, its value and limit.
    /// Time stamps must increase strictly; cost O(n·WindowS/StepS·channels).
    /// </summary>
    /// <exception cref="ArgumentException">No channel, or a channel whose values do not match the times (a caller's mistake).</exception>
    /// <exception cref="BcPrepDataException">Non-increasing time, or invalid settings/limits.</exception>
    public static SteadyDetectionResult Detect(IReadOnlyList<double> timesS, IReadOnlyList<KeyChannel> channels, SteadySettings settings)
    {
        ArgumentNullException.ThrowIfNull(timesS);
        ArgumentNullException.ThrowIfNull(channels);
        ArgumentNullException.ThrowIfNull(settings);
        Validate(timesS, channels, settings);
        var scan = new SteadyScan(channels, settings);
        var row = new double[channels.Count];
        for (int i = 0; i < timesS.Count; i++)
        {
            for (int c = 0; c < channels.Count; c++)
            {
                row[c] = channels[c].Values[i];
            }

            scan.Add(timesS[i], row);
        }

        return scan.Finish();
    }

    internal static (ChannelCriteria Criteria, double WorstRatio) DriftScatter(ReadOnlySpan<double> t, double[] y, KeyChannel channel, SteadySettings settings, int start, int end)
    {
        int length = end - start + 1;
        var fit = TrendFit.Fit(t.Slice(start, length), y.AsSpan(start, length));
        var failures = new List<CriterionFailure>();
        double coverage = (double)fit.Count / length;
        double worst = 0.0;
        if (coverage < settings.MinFiniteFraction || fit.Count < 3)
        {
            failures.Add(new CriterionFailure(SteadyCriterion.Coverage, coverage, settings.MinFiniteFraction,
                Format($"{channel.Name}: only {coverage:P0} finite samples (need {settings.MinFiniteFraction:P0})")));
            worst = double.PositiveInfinity;
        }
        else
        {
            double bound = Math.Abs(fit.SlopePerS) + (settings.DriftCoverageFactor * fit.SlopeUncertaintyPerS);
            worst = Math.Max(bound / channel.DriftLimitPerS, fit.StandardDeviation / channel.ScatterLimit);
            if (bound > channel.DriftLimitPerS)
            {
                string how = Math.Abs(fit.SlopePerS) > channel.DriftLimitPerS ? "slope beyond limit" : "slope uncertainty reaches beyond limit";
                failures.Add(new CriterionFailure(SteadyCriterion.Drift, bound, channel.DriftLimitPerS,
                    Format($"{channel.Name}: {how}: |{MeasurementText.Number(fit.SlopePerS)}| + {settings.DriftCoverageFactor}·{MeasurementText.Number(fit.SlopeUncertaintyPerS, 3)} = {MeasurementText.Number(bound)} > {MeasurementText.Number(channel.DriftLimitPerS)} per s ({bound / channel.DriftLimitPerS:F2}× limit) in [{t[start]}, {t[end]}] s")));
            }

            if (fit.StandardDeviation > channel.ScatterLimit)
            {
                failures.Add(new CriterionFailure(SteadyCriterion.Scatter, fit.StandardDeviation, channel.ScatterLimit,
                    Format($"{channel.Name}: standard deviation {MeasurementText.Number(fit.StandardDeviation)} > {MeasurementText.Number(channel.ScatterLimit)} ({fit.StandardDeviation / channel.ScatterLimit:F2}× limit) in [{t[start]}, {t[end]}] s")));
            }

            if (fit.Mean < channel.MinimumValue)
            {
                worst = double.PositiveInfinity;
                failures.Add(new CriterionFailure(SteadyCriterion.Range, fit.Mean, channel.MinimumValue,
                    Format($"{channel.Name}: mean {MeasurementText.Number(fit.Mean)} below the operating minimum {MeasurementText.Number(channel.MinimumValue)} in [{t[start]}, {t[end]}] s (rig at rest, not an operating point)")));
            }
        }

        var criteria = new ChannelCriteria(channel.Name, fit.Mean, fit.SlopePerS, fit.SlopeUncertaintyPerS, fit.ResidualAr1,
            channel.DriftLimitPerS, fit.StandardDeviation, channel.ScatterLimit, double.NaN, double.NaN, double.NaN, failures);
        return (criteria, worst);
    }

    internal static List<(int Start, int End)> SplitAtSetPointSteps(ReadOnlySpan<double> t, double[][] y, IReadOnlyList<KeyChannel> channels, int start, int end, SteadySettings settings)
    {
        double half = settings.WindowS / 2.0;
        var cuts = new List<int>();
        int runBest = -1;
        double runBestScore = 0.0;
        for (int k = start + 1; k <= end; k++)
        {
            double score = 0.0;
            if (t[k] - t[start] >= half && t[end] - t[k] >= half)
            {
                for (int c = 0; c < channels.Count; c++)
                {
                    double before = MeanBetween(t, y[c], t[k] - half, t[k], k, -1);
                    double after = MeanBetween(t, y[c], t[k], t[k] + half, k, +1);
                    score = Math.Max(score, Math.Abs(after - before) / channels[c].StepThreshold);
                }
            }

            if (score > 1.0)
            {
                if (score > runBestScore)
                {
                    runBestScore = score;
                    runBest = k;
                }
            }
            else if (runBest >= 0)
            {
                cuts.Add(runBest);
                runBest = -1;
                runBestScore = 0.0;
            }
        }

        if (runBest >= 0)
        {
            cuts.Add(runBest);
        }

        var pieces = new List<(int, int)>();
        int s = start;
        foreach (int cut in cuts)
        {
            pieces.Add((s, cut - 1));
            s = cut;
        }

        pieces.Add((s, end));
        return pieces;
    }

    /// <summary>
    /// A set-point change that begins inside the last steady test window moves only its last few blocks: too few to
    /// fail the drift rule, yet they are no longer the old operating point. Walks back from the end while any key
    /// channel's block lies more than <see cref="DepartureSigmas"/> robust standard deviations (1.4826·MAD) from the
    /// median of the WindowS/2 before it. Median and MAD, because the blocks already departed sit in that reference.
    /// </summary>
    internal static int TrimTrailingDeparture(ReadOnlySpan<double> t, double[][] y, int start, int end, SteadySettings settings)
    {
        double half = settings.WindowS / 2.0;
        int e = end;
        while (e > start && t[e] - t[start] > half && Departs(t, y, e, half))
        {
            e--;
        }

        return e;
    }

    // Common practice: 4 standard deviations, so that a steady block is trimmed by chance about once in 16 000.
    private const double DepartureSigmas = 4.0;

    private static bool Departs(ReadOnlySpan<double> t, double[][] y, int k, double half)
    {
        foreach (double[] values in y)
        {
            if (!double.IsFinite(values[k]))
            {
                continue;
            }

            var reference = new List<double>();
            for (int i = k - 1; i >= 0 && t[i] >= t[k] - half; i--)
            {
                if (double.IsFinite(values[i]))
                {
                    reference.Add(values[i]);
                }
            }

            if (reference.Count < 5)
            {
                continue;
            }

            double median = Median(reference);
            double mad = Median(reference.Select(v => Math.Abs(v - median)).ToList());
            if (mad > 0 && Math.Abs(values[k] - median) > DepartureSigmas * 1.4826 * mad)
            {
                return true;
            }
        }

        return false;
    }

    private static double Median(List<double> values)
    {
        values.Sort();
        int n = values.Count;
        return n % 2 == 1 ? values[n / 2] : 0.5 * (values[(n / 2) - 1] + values[n / 2]);
    }

    /// <summary>Mean of finite samples from index k stepping by dir while time stays in [fromS, toS) (before) or [fromS, toS) (after).</summary>
    private static double MeanBetween(ReadOnlySpan<double> t, double[] y, double fromS, double toS, int k, int dir)
    {
        double sum = 0.0;
        int count = 0;
        for (int i = dir < 0 ? k - 1 : k; i >= 0 && i < t.Length && t[i] >= fromS && t[i] < toS; i += dir)
        {
            if (double.IsFinite(y[i]))
            {
                sum += y[i];
                count++;
            }
        }

        return count > 0 ? sum / count : double.NaN;
    }

    internal static void EvaluateStretch(ReadOnlySpan<double> t, double[][] y, IReadOnlyList<KeyChannel> channels, SteadySettings settings,
        int start, int end, List<SteadyWindow> accepted, List<RejectedStretch> rejected)
    {
        double duration = t[end] - t[start];
        if (duration < settings.MinStretchS)
        {
            rejected.Add(new RejectedStretch(t[start], t[end], t[start], t[end],
                Format($"{ChoiceSpelling.Name(SteadyCriterion.Duration)}: steady for {duration} s, shorter than the minimum {settings.MinStretchS} s"), []));
            return;
        }

        int tailStart = start;
        while (t[end] - t[tailStart] > settings.TailS)
        {
            tailStart++;
        }

        var rSettings = settings.RTestOrDefault;
        var criteria = new List<ChannelCriteria>();
        var passed = SteadyMethod.DriftScatter | SteadyMethod.RTest | SteadyMethod.Mser;
        for (int c = 0; c < channels.Count; c++)
        {
            var (dc, _) = DriftScatter(t, y[c], channels[c], settings, tailStart, end);
            var failures = new List<CriterionFailure>(dc.Failures);
            if (failures.Count > 0)
            {
                passed &= ~SteadyMethod.DriftScatter;
            }

            var stretch = y[c].AsSpan(start, end - start + 1);
            double r = RTest.Compute(stretch, rSettings)[^1];
            if (!(r < rSettings.RCritical))
            {
                passed &= ~SteadyMethod.RTest;
                failures.Add(new CriterionFailure(SteadyCriterion.RTest, r, rSettings.RCritical,
                    Format($"{channels[c].Name}: R = {r:F3} ≥ R_crit {rSettings.RCritical} at {t[end]} s")));
            }

            double mserS = double.NaN;
            if (stretch.Length / settings.MserBatchSize >= 4 && AllFinite(stretch))
            {
                var mser = Mser.Truncate(stretch, settings.MserBatchSize);
                mserS = t[start + mser.TruncationSamples] - t[start];
                if (!mser.InsideFirstHalf)
                {
                    passed &= ~SteadyMethod.Mser;
                    failures.Add(new CriterionFailure(SteadyCriterion.Mser, mserS, duration / 2.0,
                        Format($"{channels[c].Name}: MSER-{settings.MserBatchSize} truncation at the end of the searched half ({mserS} s)")));
                }
            }
            else
            {
                passed &= ~SteadyMethod.Mser;
            }

            criteria.Add(dc with { R = r, RCritical = rSettings.RCritical, MserTruncationS = mserS, Failures = failures });
        }

        if ((passed & settings.RequiredMethods) == settings.RequiredMethods)
        {
            accepted.Add(new SteadyWindow(t[tailStart], t[end], t[start], t[end], passed, criteria));
        }
        else
        {
            var missing = settings.RequiredMethods & ~passed;
            rejected.Add(new RejectedStretch(t[start], t[end], t[tailStart], t[end],
                Format($"required method(s) {ChoiceSpelling.Names(missing)} failed on the averaging window"), criteria));
        }
    }

    private static bool AllFinite(ReadOnlySpan<double> x)
    {
        foreach (double v in x)
        {
            if (!double.IsFinite(v))
            {
                return false;
            }
        }

        return true;
    }

    internal static RejectedStretch ExplainFailingRun(ReadOnlySpan<double> t, IReadOnlyList<WindowEvaluation> windows, int first, int last)
    {
        var best = windows[first];
        for (int k = first + 1; k <= last; k++)
        {
            if (windows[k].WorstRatio < best.WorstRatio)
            {
                best = windows[k];
            }
        }

        var reasons = best.Channels.SelectMany(c => c.Failures).Select(f => f.Description);
        return new RejectedStretch(t[windows[first].Start], t[windows[last].End], t[best.Start], t[best.End],
            "closest window still failed: " + string.Join("; ", reasons), best.Channels);
    }

    private static void Validate(IReadOnlyList<double> timesS, IReadOnlyList<KeyChannel> channels, SteadySettings s)
    {
        ValidateLimits(channels, s);
        if (timesS.Count < 3)
        {
            throw new BcPrepDataException("Steady-state detection needs at least 3 time stamps.");
        }

        for (int i = 0; i < timesS.Count; i++)
        {
            if (!double.IsFinite(timesS[i]) || (i > 0 && timesS[i] <= timesS[i - 1]))
            {
                throw new BcPrepDataException(Format($"Time stamp {i} ({timesS[i]} s) is not finite or not after the previous one."));
            }
        }

        foreach (var c in channels)
        {
            if (c.Values.Count != timesS.Count)
            {
                throw new ArgumentException(Format($"Channel '{c.Name}' has {c.Values.Count} values for {timesS.Count} time stamps."), nameof(channels));
            }
        }
    }

    /// <summary>Checks the key channels' limits and the settings, which a scan needs before its first block mean.</summary>
    internal static void ValidateLimits(IReadOnlyList<KeyChannel> channels, SteadySettings s)
    {
        if (channels.Count == 0)
        {
            throw new ArgumentException("Steady-state detection needs at least one key channel.", nameof(channels));
        }

        foreach (var c in channels)
        {
            if (!(c.DriftLimitPerS > 0.0) || !(c.ScatterLimit > 0.0) || !(c.StepThreshold > 0.0) || double.IsNaN(c.MinimumValue))
            {
                throw new BcPrepDataException(Format(
                    $"Channel '{c.Name}': drift limit {c.DriftLimitPerS}/s, scatter limit {c.ScatterLimit} and step threshold {c.StepThreshold} must all be positive (operating minimum {c.MinimumValue} not NaN)."));
            }
        }

        if (!(s.WindowS > 0) || !(s.StepS > 0) || !(s.TailS > 0) || !(s.MinStretchS >= s.TailS) || !(s.DriftCoverageFactor >= 0)
            || !(s.MinFiniteFraction > 0 && s.MinFiniteFraction <= 1) || s.MserBatchSize < 1)
        {
            throw new BcPrepDataException(Format(
                $"Steady settings invalid: window {s.WindowS} s, step {s.StepS} s and tail {s.TailS} s must be positive, minimum stretch {s.MinStretchS} s ≥ tail, k {s.DriftCoverageFactor} ≥ 0, finite fraction {s.MinFiniteFraction} in (0, 1], MSER batch {s.MserBatchSize} ≥ 1."));
        }

        s.RTestOrDefault.Validate();
    }

    internal static string Format(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
