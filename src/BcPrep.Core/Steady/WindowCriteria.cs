using System.Globalization;

namespace BcPrep.Steady;

/// <summary>The criteria a steady window is judged by (scatter, range, coverage; the trailing departure), shared by <see cref="PlateauDetector"/>.</summary>
public static class WindowCriteria
{
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
