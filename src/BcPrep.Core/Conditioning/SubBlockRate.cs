namespace BcPrep.Conditioning;

/// <summary>
/// Chooses how finely the detection blocks are split before the conditioning chain runs on their means, when only
/// block means are wanted (steady detection and the day plots). A sub-block that holds whole mains periods nulls the
/// hum and its harmonics exactly, as the notch would, so the notch is not needed at the sub-block rate (it lies above
/// that rate's Nyquist frequency and the chain skips it); the low-pass then runs on a few dozen values per block instead
/// of every sample. The sub-block rate is kept at least <see cref="CutoffMargin"/> times the low-pass cutoff, so the
/// sub-block's own averaging changes the pass band by less than 0.1 % (sinc(1/40) = 1 − 1.0·10⁻³).
/// </summary>
public static class SubBlockRate
{
    /// <summary>Sub-block rate ÷ low-pass cutoff, at least. Our choice (see the class summary).</summary>
    public const double CutoffMargin = 40.0;

    /// <summary>Fewest samples a sub-block must hold to be worth forming; below, the samples are conditioned as they are.</summary>
    public const int MinimumSamples = 4;

    /// <summary>
    /// Fewest sub-blocks per block (when the samples allow): the Hampel filter then judges 20 or more values per block,
    /// so a value it replaces moves its block mean by a twentieth of the change at most. Our choice.
    /// </summary>
    public const int MinimumPerBlock = 20;

    /// <summary>
    /// Sub-blocks per detection block, or null when no split fits and the chain must run at the full rate: the
    /// smallest count N, at least <see cref="MinimumPerBlock"/> where the samples allow, such that a sub-block holds a
    /// whole number of samples (at least <see cref="MinimumSamples"/>),
    /// a whole number of mains periods when a mains frequency is set, and N / block ≥ CutoffMargin · cutoff when a
    /// low-pass is set. A block that is not a whole number of samples long also gives null.
    /// </summary>
    public static int? SubBlocksPerBlock(double sampleIntervalS, double blockS, double? mainsHz, double? lowPassCutoffHz)
    {
        if (!(sampleIntervalS > 0.0) || !(blockS > 0.0))
        {
            return null;
        }
        var samplesPerBlock = blockS / sampleIntervalS;
        var whole = Math.Round(samplesPerBlock);
        if (whole < MinimumSamples || Math.Abs(samplesPerBlock - whole) > 1e-6 * whole)
        {
            return null;
        }
        var samples = (long)whole;
        var fewest = Math.Min(MinimumPerBlock, samples / MinimumSamples);
        for (long n = fewest; n <= samples / MinimumSamples; n++)
        {
            if (samples % n != 0)
            {
                continue;
            }
            if (mainsHz is double mains && !IsWhole(mains * blockS / n))
            {
                continue;
            }
            if (lowPassCutoffHz is double cutoff && n / blockS < CutoffMargin * cutoff)
            {
                continue;
            }
            return (int)n;
        }
        return null;
    }

    private static bool IsWhole(double periods) => periods >= 1.0 - 1e-9 && Math.Abs(periods - Math.Round(periods)) < 1e-9 * Math.Max(1.0, periods);
}
