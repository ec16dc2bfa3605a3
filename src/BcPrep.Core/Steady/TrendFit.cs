namespace BcPrep.Steady;

/// <summary>
/// Least-squares line through a window: mean, slope (unit/s) with an autocorrelation-inflated standard uncertainty,
/// lag-1 autocorrelation of the residuals, and the sample standard deviation of the values about their mean.
/// </summary>
public readonly record struct TrendFit(int Count, double Mean, double SlopePerS, double SlopeUncertaintyPerS, double ResidualAr1, double StandardDeviation)
{
    /// <summary>Largest AR(1) coefficient used for the inflation; keeps the factor finite (√((1+φ)/(1−φ)) ≤ ≈14).</summary>
    public const double MaxAr1 = 0.99;

    /// <summary>
    /// OLS fit y = a + b·t over finite samples. u(b) = s_e/√Sxx · √((1+φ)/(1−φ)), s_e² = SSE/(n − 2), φ = lag-1
    /// autocorrelation of the residuals Σe_i e_{i−1}/Σe_i², clamped to [0, 0.99]: the large-n variance factor of an OLS
    /// slope under AR(1) errors (negative φ is not used to shrink u — conservative). Standard deviation is about the
    /// mean (n − 1), so a drift inside the window counts as scatter too. Fewer than 3 finite samples: NaN fields.
    /// Assumes samples in time order; NaN samples are skipped (they do not break the residual lag pairs).
    /// </summary>
    public static TrendFit Fit(ReadOnlySpan<double> timesS, ReadOnlySpan<double> values)
    {
        int n = 0;
        double tMean = 0.0, yMean = 0.0;
        for (int i = 0; i < values.Length; i++)
        {
            if (double.IsFinite(values[i]))
            {
                n++;
                tMean += timesS[i];
                yMean += values[i];
            }
        }

        if (n < 3)
        {
            return new TrendFit(n, n > 0 ? yMean / n : double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        }

        tMean /= n;
        yMean /= n;
        double sxx = 0.0, sxy = 0.0, syy = 0.0;
        for (int i = 0; i < values.Length; i++)
        {
            if (double.IsFinite(values[i]))
            {
                double dt = timesS[i] - tMean, dy = values[i] - yMean;
                sxx += dt * dt;
                sxy += dt * dy;
                syy += dy * dy;
            }
        }

        double slope = sxy / sxx;
        double sse = 0.0, lag = 0.0, previous = double.NaN;
        for (int i = 0; i < values.Length; i++)
        {
            if (double.IsFinite(values[i]))
            {
                double e = values[i] - yMean - (slope * (timesS[i] - tMean));
                sse += e * e;
                if (!double.IsNaN(previous))
                {
                    lag += e * previous;
                }

                previous = e;
            }
        }

        double phi = sse > 0.0 ? Math.Clamp(lag / sse, 0.0, MaxAr1) : 0.0;
        double u = Math.Sqrt(sse / (n - 2) / sxx) * Math.Sqrt((1.0 + phi) / (1.0 - phi));
        return new TrendFit(n, yMean, slope, u, phi, Math.Sqrt(syy / (n - 1)));
    }
}
