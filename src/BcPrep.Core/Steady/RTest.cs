using System.Globalization;

namespace BcPrep.Steady;

/// <summary>
/// Settings of the Cao &amp; Rhinehart (1995) R-test. Default filter factors λ1 = 0.2, λ2 = 0.1, λ3 = 0.1 (the paper's,
/// per the domain reference). Default R_crit = 1.43 is the 95 % quantile of a SIMULATION on white Gaussian noise
/// (domain reference 5.1), not the published 1997 table.
/// </summary>
public sealed record RTestSettings(double Lambda1 = 0.2, double Lambda2 = 0.1, double Lambda3 = 0.1, double RCritical = 1.43)
{
    internal void Validate()
    {
        foreach (var (name, value) in new[] { ("λ1", Lambda1), ("λ2", Lambda2), ("λ3", Lambda3) })
        {
            if (!(value > 0.0 && value <= 1.0))
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture, $"R-test {name} = {value} must lie in (0, 1]."));
            }
        }

        if (!(RCritical > 0.0) || !double.IsFinite(RCritical))
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture, $"R-test critical value {RCritical} must be positive."));
        }
    }
}

/// <summary>Cao &amp; Rhinehart (1995) ratio-of-variances steady-state statistic.</summary>
public static class RTest
{
    /// <summary>
    /// R_i = (2 − λ1)·v²_i / δ²_i with X_f,i = λ1·X_i + (1 − λ1)·X_f,i−1,
    /// v²_i = λ2·(X_i − X_f,i−1)² + (1 − λ2)·v²_i−1, δ²_i = λ3·(X_i − X_i−1)² + (1 − λ3)·δ²_i−1.
    /// R ≈ 1 for white noise about a constant, R ≫ 1 on a trend; autocorrelated noise also inflates R.
    /// Initialisation (ours): X_f,0 = X_0; δ²_0 = mean squared successive difference of the first min(n, 20) samples;
    /// v²_0 = δ²_0/(2 − λ1) (their white-noise expectations), so R_0 = 1. R is NaN where δ² = 0 and at index 0 of a
    /// one-sample series. NaN samples are skipped (the filters hold their state; R repeats the last value).
    /// </summary>
    public static double[] Compute(ReadOnlySpan<double> x, RTestSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        settings.Validate();
        var r = new double[x.Length];
        int first = FirstFinite(x, 0);
        if (first < 0)
        {
            r.AsSpan().Fill(double.NaN);
            return r;
        }

        double l1 = settings.Lambda1, l2 = settings.Lambda2, l3 = settings.Lambda3;
        double delta2 = InitialSquaredDifference(x, first);
        double v2 = delta2 / (2.0 - l1);
        double xf = x[first];
        double previous = x[first];
        r.AsSpan(0, first + 1).Fill(delta2 > 0.0 ? 1.0 : double.NaN);
        for (int i = first + 1; i < x.Length; i++)
        {
            double xi = x[i];
            if (!double.IsFinite(xi))
            {
                r[i] = r[i - 1];
                continue;
            }

            v2 = (l2 * (xi - xf) * (xi - xf)) + ((1.0 - l2) * v2);
            xf = (l1 * xi) + ((1.0 - l1) * xf);
            delta2 = (l3 * (xi - previous) * (xi - previous)) + ((1.0 - l3) * delta2);
            previous = xi;
            r[i] = delta2 > 0.0 ? (2.0 - l1) * v2 / delta2 : double.NaN;
        }

        return r;
    }

    private static int FirstFinite(ReadOnlySpan<double> x, int from)
    {
        for (int i = from; i < x.Length; i++)
        {
            if (double.IsFinite(x[i]))
            {
                return i;
            }
        }

        return -1;
    }

    private static double InitialSquaredDifference(ReadOnlySpan<double> x, int first)
    {
        double sum = 0.0;
        int count = 0;
        double previous = x[first];
        for (int i = first + 1; i < x.Length && count < 20; i++)
        {
            if (double.IsFinite(x[i]))
            {
                sum += (x[i] - previous) * (x[i] - previous);
                previous = x[i];
                count++;
            }
        }

        return count > 0 ? sum / count : 0.0;
    }
}
