using System.Numerics;
using System.Runtime.CompilerServices;

namespace BcPrep.Uncertainty;

/// <summary>
/// The biased sample autocorrelation ρ̂(k) = Σᵢ dᵢ dᵢ₊ₖ / Σᵢ dᵢ² (d = x − mean; the estimator of MathNet's
/// Correlation.Auto), computed only as far as it is read. The Sokal and Bartlett cut-offs stop after a few times
/// the correlation time, usually tens of lags, so direct sums over those lags cost far less than an FFT of the
/// whole window; when many lags are needed (a slow or drifting channel) it switches to one FFT of the whole window.
/// </summary>
internal sealed class LazyAutocorrelation
{
    /// <summary>
    /// Beyond this many lags the whole window goes through one FFT. Lags are extended by doubling, so a channel that
    /// needs more than 256 lags (most slow ones) paid for 256 direct sums before its FFT; with the vectorised FFT at
    /// about three times the cost of 64 direct lags (n = 150 000), stopping the sums at 64 costs a channel with a
    /// cut-off between 64 and 128 a little and saves each slow channel more (measured on the benchmark day: five
    /// slow channels and one between 64 and 128 per window).
    /// </summary>
    internal const int DirectLagLimit = 64;

    private readonly double[] _samples;
    private readonly double[] _deviations;
    private readonly double _sumOfSquares;
    private readonly double _mean;
    private double[] _rho;
    private int _known;

    public LazyAutocorrelation(double[] samples, double mean)
    {
        _samples = samples;
        _mean = mean;
        // Scratch: the estimator is used and dropped within one window mean on one thread.
        _deviations = ThreadScratch.Rent(ScratchSlots.Deviations, samples.Length);
        var ss = 0.0;
        for (var i = 0; i < samples.Length; i++)
        {
            var d = samples[i] - mean;
            _deviations[i] = d;
            ss += d * d;
        }
        _sumOfSquares = ss;
        _rho = new double[Math.Min(samples.Length, 64)];
        _rho[0] = 1.0;
        _known = 1;
    }

    public int Length => _samples.Length;

    public double this[int lag]
    {
        get
        {
            if (lag >= _known)
            {
                Extend(lag);
            }
            return _rho[lag];
        }
    }

    private void Extend(int lag)
    {
        var target = Math.Min(Length, Math.Max(lag + 1, 2 * _known));
        if (target > DirectLagLimit)
        {
            _rho = FftAutocorrelation.Compute(_samples, _mean);
            _known = Length;
            return;
        }
        if (_rho.Length < target)
        {
            Array.Resize(ref _rho, target);
        }
        for (var k = _known; k < target; k++)
        {
            _rho[k] = LaggedProduct(_deviations.AsSpan(0, Length), k) / _sumOfSquares;
        }
        _known = target;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static double LaggedProduct(ReadOnlySpan<double> d, int lag)
    {
        var a = d[..^lag];
        var b = d[lag..];
        var width = Vector<double>.Count;
        var acc = Vector<double>.Zero;
        var i = 0;
        for (; i <= a.Length - width; i += width)
        {
            acc += new Vector<double>(a.Slice(i, width)) * new Vector<double>(b.Slice(i, width));
        }
        var sum = Vector.Sum(acc);
        for (; i < a.Length; i++)
        {
            sum += a[i] * b[i];
        }
        return sum;
    }
}
