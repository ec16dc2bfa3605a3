namespace BcPrep.Uncertainty;

/// <summary>
/// The biased sample autocorrelation ρ̂(k) = Σᵢ dᵢ dᵢ₊ₖ / Σᵢ dᵢ² (d = x − mean; the estimator of MathNet's
/// Correlation.Auto), computed only as far as it is read. The Sokal and Bartlett cut-offs stop after a few times the
/// correlation time, so the lags are computed in growing ranges: the first ones by direct sums
/// (<see cref="DirectLagSums"/>), then by sectioned correlation over blocks a little longer than the lags wanted
/// (<see cref="SectionedAutocorrelation"/>, about n·log L for L lags), and only when the lags wanted come near the
/// window's length by one FFT of the whole window (<see cref="FftAutocorrelation"/>). The lags live in the thread's
/// scratch, so one estimator at a time per thread: it is made and dropped within one window mean.
/// </summary>
internal sealed class LazyAutocorrelation
{
    /// <summary>
    /// Lags up to this many are summed directly. Measured on 1 M samples (LagRouteBenchmarks, a loaded 2-core machine):
    /// sections of L cost 0.3, 0.3, 1.5, 1.0 and 0.6 times the direct sums of 16, 32, 64, 128 and 256 lags, so the two
    /// cross near 128. The limit stays at 64 because every slow channel (a drift, most of a real day's slow ones) sums
    /// the direct lags before it is sent to the whole window: lags 64–127 directly would cost each of those about
    /// as much again, to save a little on the rare channel whose cut-off falls between 64 and 128.
    /// </summary>
    internal const int DirectLagLimit = 64;

    /// <summary>The first direct range: a sweep of up to 16 lags costs about what one of a single lag costs (memory-bound).</summary>
    private const int FirstDirectLags = 16;

    /// <summary>The shortest section: 1024 lags, so a hum of a few tens of samples averages out of the prediction after one pass.</summary>
    private const int MinimumSection = 1024;

    private readonly ReadOnlyMemory<double> _samples;
    private readonly double _sumOfSquares;
    private readonly double _mean;
    private double[] _rho;
    private int _known;

    /// <summary>
    /// Windows longer than this take their whole-window lags from two shorter transforms when that needs fewer
    /// points (<see cref="SplitsWholeWindow"/>); shorter ones keep the one transform of 2n, whose arrays are small.
    /// </summary>
    internal const int SplitFrom = 1 << 16;

    // The whole window's lags stay in the FFT's scratch (no array of the window's length): lag k is
    // (k even ? re[k/2] : im[k/2]) / re[0]. Null until that route is taken; it is the last route (all lags known).
    private double[]? _wholeRe;
    private double[]? _wholeIm;

    // A split whole window (SplitsWholeWindow): the lags from _farFrom on are FarLagSums' (lag k at
    // re[k − _farFrom]·_farScale / _zeroLag), computed into the same scratch when first read, and the near ones computed
    // again if read after them. _farFrom is the window's length when the whole window is one transform.
    private int _farFrom;
    private int _wholeSize;
    private int _farPoints;
    private double _farScale;
    private double _zeroLag;
    private bool _holdsFar;

    public LazyAutocorrelation(double[] samples, double mean)
        : this(samples, mean, SumOfSquares(samples, mean))
    {
    }

    /// <inheritdoc cref="LazyAutocorrelation(ReadOnlyMemory{double}, double, double)"/>
    public LazyAutocorrelation(double[] samples, double mean, double sumOfSquares)
        : this(samples.AsMemory(), mean, sumOfSquares)
    {
    }

    /// <param name="samples">The window.</param>
    /// <param name="mean">Its mean.</param>
    /// <param name="sumOfSquares">Σᵢ (xᵢ − mean)², summed in order (as <see cref="SumOfSquares"/> does), when the caller has it.</param>
    public LazyAutocorrelation(ReadOnlyMemory<double> samples, double mean, double sumOfSquares)
    {
        _samples = samples;
        _mean = mean;
        _sumOfSquares = sumOfSquares;
        // Scratch: the estimator is used and dropped within one window mean on one thread.
        _rho = ThreadScratch.Rent(ScratchSlots.Autocorrelation, Math.Min(samples.Length, DirectLagLimit));
        _rho[0] = 1.0;
        _known = 1;
    }

    public int Length => _samples.Length;

    /// <summary>How the lags were last extended (for tests and benchmarks).</summary>
    internal AutocorrelationRoute LastRoute { get; private set; } = AutocorrelationRoute.None;

    /// <summary>How many sectioned passes ran (for tests and benchmarks).</summary>
    internal int SectionPasses { get; private set; }

    public double this[int lag]
    {
        get
        {
            if ((uint)lag >= (uint)Length)
            {
                throw new ArgumentOutOfRangeException(nameof(lag), lag, $"Lag must lie within [0, {Length}).");
            }
            if (lag >= _known)
            {
                Extend(lag);
            }
            if (_wholeRe is null)
            {
                return _rho[lag];
            }
            if (lag >= _farFrom)
            {
                return FarLag(lag);
            }
            if (_holdsFar)
            {
                NearLags();
            }
            var re = _wholeRe;
            return ((lag & 1) == 0 ? re[lag >> 1] : _wholeIm![lag >> 1]) / re[0];
        }
    }

    private void Extend(int lag)
    {
        var n = Length;
        var directLimit = Math.Min(n, DirectLagLimit);
        if (_known < directLimit)
        {
            // The direct lags come first even when a far lag is read, so the prediction below has them to go by.
            var end = Math.Min(directLimit, Math.Max(lag + 1, Math.Max(2 * _known, FirstDirectLags)));
            Grow(end);
            DirectLagSums.Compute(_samples.Span, _mean, _known, end, _rho);
            Normalise(_known, end);
            _known = end;
            LastRoute = AutocorrelationRoute.Direct;
            if (lag < _known)
            {
                return;
            }
        }
        var target = Math.Min(n, Math.Max(lag + 1, 2 * _known));
        // A first section of at least MinimumSection lags costs little more than a shorter one (log L) and gives the
        // prediction long ranges to average over.
        var block = PowerOfTwoAtLeast(Math.Max(Math.Max(target, PredictedLags()), MinimumSection));
        // The whole window's transform has PowerOfTwoAtLeast(n) complex points; once the blocks reach half of it,
        // two or three section transforms cost what the whole window's two do.
        if (block >= PowerOfTwoAtLeast(n) / 2)
        {
            if (SplitsWholeWindow(n, out var size, out var farPoints))
            {
                _wholeSize = size;
                _farFrom = size - n + 1;
                _farPoints = farPoints;
                // The near transform leaves (size/2)·r(k), the far one M·r(k): both powers of two, so the ratio is exact.
                _farScale = (size / 2) / (double)farPoints;
                NearLags();
            }
            else
            {
                _farFrom = n;
                (_wholeRe, _wholeIm) = FftAutocorrelation.UnnormalisedLags(_samples.Span, _mean);
            }
            _known = n;
            LastRoute = AutocorrelationRoute.WholeWindow;
            return;
        }
        Grow(block);
        SectionedAutocorrelation.Compute(_samples.Span, _mean, block, _known, _rho);
        Normalise(_known, block);
        _known = block;
        LastRoute = AutocorrelationRoute.Sectioned;
        SectionPasses++;
    }

    /// <summary>
    /// Whether a whole window of <paramref name="n"/> samples takes its lags from two transforms: the lags below
    /// size − n + 1 from one of <paramref name="size"/> = the smallest power of two ≥ n real points (half the 2n of
    /// the single transform), the far ones from <see cref="FarLagSums"/> at <paramref name="farPoints"/> complex points.
    /// It does when the far transform needs no more than the near one's size/2 (n ≤ about 5/8 of size; a 20-minute
    /// window at 1 kHz, 1.2 M samples, needs two arrays of 2²⁰ values instead of 2²¹: 34 MB less per statistics
    /// thread); each lag is then computed once when read in order, as the cut-offs read them.
    /// </summary>
    internal static bool SplitsWholeWindow(int n, out int size, out int farPoints)
    {
        size = PowerOfTwoAtLeast(n);
        var farLags = n - (size - n + 1);
        farPoints = PowerOfTwoAtLeast(2 * Math.Max(farLags, 1));
        return n > SplitFrom && farLags >= 1 && farPoints <= size / 2;
    }

    /// <summary>Complex points in each of the two arrays the whole-window route of <paramref name="n"/> samples needs.</summary>
    internal static int WholeWindowPoints(int n) =>
        SplitsWholeWindow(n, out var size, out _) ? size / 2 : FftAutocorrelation.ComplexPoints(n);

    private void NearLags()
    {
        (_wholeRe, _wholeIm) = FftAutocorrelation.UnnormalisedLags(_samples.Span, _mean, _wholeSize);
        _zeroLag = _wholeRe[0];
        _holdsFar = false;
    }

    private double FarLag(int lag)
    {
        if (!_holdsFar)
        {
            var re = ThreadScratch.Rent(ScratchSlots.FftReal, _farPoints);
            var im = ThreadScratch.Rent(ScratchSlots.FftImaginary, _farPoints);
            FarLagSums.Compute(_samples.Span, _mean, _farFrom, re, im, _farPoints);
            (_wholeRe, _wholeIm) = (re, im);
            _holdsFar = true;
            FarPasses++;
        }
        return _wholeRe![lag - _farFrom] * _farScale / _zeroLag;
    }

    /// <summary>How many times the far lags of a split whole window were computed (for tests).</summary>
    internal int FarPasses { get; private set; }

    /// <summary>
    /// Lags the cut-off will probably read, from how ρ̂ decays between the means over two ranges of the known lags,
    /// [K/4, K/2) and [K/2, K) (means, so that a hum's oscillation averages out): with ρ̂ ≈ e^(−k/τ), the Sokal window
    /// (c = 5) stops near 5(1 + 2τ) and the Bartlett band sooner; 8(1 + 2τ) leaves room for the estimate's scatter (a
    /// longer section costs only log L more, a second pass n·log L), and a section that falls short is doubled. A
    /// correlation that has decayed (or oscillates about zero) gives 0: plain doubling. One that does not decay (a
    /// drift) asks for the whole window. Only the cost depends on this, never a value.
    /// </summary>
    private int PredictedLags()
    {
        var early = MeanRho(_known / 4, _known / 2);
        var late = MeanRho(_known / 2, _known);
        if (!(late > 0.05 && early > 0.05))
        {
            return 0;
        }
        if (late >= early)
        {
            return Length;
        }
        // The ranges' centres lie 3K/8 apart.
        var tau = (3.0 * _known / 8.0) / Math.Log(early / late);
        var lags = 8.0 * (1.0 + (2.0 * tau));
        return lags >= Length ? Length : (int)lags;
    }

    private double MeanRho(int from, int to)
    {
        var sum = 0.0;
        for (var k = from; k < to; k++)
        {
            sum += _rho[k];
        }
        return sum / (to - from);
    }

    private void Grow(int length)
    {
        if (_rho.Length >= length)
        {
            return;
        }
        var grown = ThreadScratch.Rent(ScratchSlots.Autocorrelation, length);
        if (!ReferenceEquals(grown, _rho))
        {
            Array.Copy(_rho, grown, _known);
        }
        _rho = grown;
    }

    private void Normalise(int from, int to)
    {
        for (var k = from; k < to; k++)
        {
            _rho[k] /= _sumOfSquares;
        }
    }

    /// <summary>Σᵢ (xᵢ − mean)², in order.</summary>
    internal static double SumOfSquares(ReadOnlySpan<double> samples, double mean)
    {
        var ss = 0.0;
        for (var i = 0; i < samples.Length; i++)
        {
            var d = samples[i] - mean;
            ss += d * d;
        }
        return ss;
    }

    private static int PowerOfTwoAtLeast(int value)
    {
        var p = 1;
        while (p < value)
        {
            p <<= 1;
        }
        return p;
    }
}

/// <summary>Which computation gave a <see cref="LazyAutocorrelation"/> its latest lags.</summary>
internal enum AutocorrelationRoute
{
    None,
    Direct,
    Sectioned,
    WholeWindow,
}
