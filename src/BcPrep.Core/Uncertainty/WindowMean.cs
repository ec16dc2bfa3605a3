using System.Globalization;
using MathNet.Numerics.Statistics;

namespace BcPrep.Uncertainty;

/// <summary>
/// Type A uncertainty of the mean of an autocorrelated steady window (reference sheet 4.1):
/// var(x̄) = σ²γ_n/n with γ_n = 1 + 2 Σ (1 − k/n) ρ(k); n_eff = n/γ_n; the unbiased estimate
/// u(x̄) = s·√[(n − 1)/(n(n_eff − 1))] corrects for E[s²] = σ²(n − γ_n)/(n − 1) (Zhang 2006, Metrologia 43 S276).
/// ρ̂(k) is computed only as far as the cut-off reads it (<see cref="LazyAutocorrelation"/>): directly over the first
/// lags, by sectioned correlation further on, by one FFT of the whole window when the cut-off needs most of it.
/// </summary>
/// <remarks>
/// Degrees of freedom: ν = min(n_eff − 1, n/(2M + 1)). The first term is the common practice; alone it ignores that
/// γ̂_n itself is an estimate, and 95 % intervals then cover AR(1) truths only ~93 % of the time (tested). The second
/// term is the reliability of u through γ̂: var(γ̂)/γ² ≈ 2(2M + 1)/n for a window summed to lag M (Sokal 1997, from
/// memory), so Δu/u ≈ √((2M + 1)/(2n)) and GUM G.3 gives ν = ½(Δu/u)⁻² = n/(2M + 1).
/// </remarks>
public static class WindowMean
{
    /// <summary>
    /// Evaluates one window. Throws <see cref="BcPrepDataException"/> when n &lt; 3, a sample is NaN/∞, or the
    /// window holds fewer than 2 effectively independent samples (n_eff &lt; 2: the window is too short for its
    /// correlation time, or it drifts). A constant window returns u = 0 with <see cref="WindowMeanResult.IsConstant"/>.
    /// </summary>
    public static WindowMeanResult Evaluate(double[] samples, WindowMeanOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(samples);
        return Evaluate(samples.AsMemory(), options);
    }

    /// <summary>
    /// As <see cref="Evaluate(double[], WindowMeanOptions?)"/>, over a part of an array (a statistics thread's scratch,
    /// which may be longer than the window).
    /// </summary>
    public static WindowMeanResult Evaluate(ReadOnlyMemory<double> samples, WindowMeanOptions? options = null)
    {
        options ??= WindowMeanOptions.Default;
        var n = samples.Length;
        if (n < 3)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Window mean needs at least 3 samples, got {n}."));
        }

        if (!(options.SokalFactor > 0.0))
        {
            throw new BcPrepDataException($"Sokal window factor {options.SokalFactor} must be > 0.");
        }

        var (mean, s, sumOfSquares, isConstant) = MeanAndStandardDeviation(samples.Span);
        var naive = s / Math.Sqrt(n);
        if (isConstant)
        {
            return new WindowMeanResult(mean, 0.0, n, 0, true, 1.0, 1.0, n, 0.0, n - 1.0, n - 1.0, double.PositiveInfinity, 0.0, true, options.Cutoff);
        }

        var rho = new LazyAutocorrelation(samples, mean, sumOfSquares);
        var (cutoff, gammaRaw, converged) = options.Cutoff == AutocorrelationCutoff.SokalWindow
            ? SokalWindow(k => rho[k], rho.Length, n, options.SokalFactor)
            : BartlettBand(k => rho[k], rho.Length, n);
        var gamma = Math.Max(gammaRaw, 1.0);
        var nEff = n / gamma;
        if (nEff < 2.0)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Window of {n} samples holds only n_eff = {MeasurementText.Number(nEff)} effectively independent samples (γ_n = {MeasurementText.Number(gamma)}); need ≥ 2. Use a longer window or check for drift."));
        }

        var u = s * Math.Sqrt((n - 1.0) / (n * (nEff - 1.0)));
        var nuGamma = n / (2.0 * cutoff + 1.0);
        return new WindowMeanResult(mean, s, n, cutoff, converged, gammaRaw, gamma, nEff, u,
            Math.Min(nEff - 1.0, nuGamma), nEff - 1.0, nuGamma, naive, false, options.Cutoff);
    }

    /// <summary>x̄, s and Σ(xᵢ − x̄)² (the autocorrelation's denominator, summed once for both).</summary>
    private static (double Mean, double StandardDeviation, double SumOfSquares, bool IsConstant) MeanAndStandardDeviation(ReadOnlySpan<double> x)
    {
        var min = double.PositiveInfinity;
        var max = double.NegativeInfinity;
        var sum = 0.0;
        for (var i = 0; i < x.Length; i++)
        {
            var v = x[i];
            if (!double.IsFinite(v))
            {
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                    $"Window sample {i} is {v}; remove or bridge invalid samples before the Type A evaluation."));
            }

            sum += v;
            min = Math.Min(min, v);
            max = Math.Max(max, v);
        }

        if (min == max)
        {
            return (min, 0.0, 0.0, true);
        }

        var mean = sum / x.Length;
        var ss = LazyAutocorrelation.SumOfSquares(x, mean);
        return (mean, Math.Sqrt(ss / (x.Length - 1.0)), ss, false);
    }

    /// <summary>Smallest M with M ≥ c·γ̂(M); returns (M, γ̂(M), converged).</summary>
    internal static (int Cutoff, double Gamma, bool Converged) SokalWindow(double[] rho, int n, double c) =>
        SokalWindow(k => rho[k], rho.Length, n, c);

    private static (int Cutoff, double Gamma, bool Converged) SokalWindow(Func<int, double> rho, int length, int n, double c)
    {
        var gamma = 1.0;
        for (var k = 1; k < length; k++)
        {
            gamma += 2.0 * (1.0 - (double)k / n) * rho(k);
            if (k >= c * gamma)
            {
                return (k, gamma, true);
            }
        }

        return (length - 1, gamma, false);
    }

    /// <summary>Sum up to the last lag before the first ρ̂(k) inside the Bartlett band; returns (m, γ̂, true).</summary>
    internal static (int Cutoff, double Gamma, bool Converged) BartlettBand(double[] rho, int n) =>
        BartlettBand(k => rho[k], rho.Length, n);

    private static (int Cutoff, double Gamma, bool Converged) BartlettBand(Func<int, double> rho, int length, int n)
    {
        var gamma = 1.0;
        var sumSquares = 0.0;
        for (var k = 1; k < length; k++)
        {
            var r = rho(k);
            var band = 2.0 * Math.Sqrt((1.0 + 2.0 * sumSquares) / n);
            if (Math.Abs(r) <= band)
            {
                return (k - 1, gamma, true);
            }

            gamma += 2.0 * (1.0 - (double)k / n) * r;
            sumSquares += r * r;
        }

        return (length - 1, gamma, true);
    }
}
