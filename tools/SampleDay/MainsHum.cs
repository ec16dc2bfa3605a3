namespace BcPrep.Tools.SampleDay;

/// <summary>
/// Mains pickup and logger dropouts of the wide benchmark shape: a 50 Hz hum with a third harmonic, its phase set per
/// channel, and single missing cells scattered over every channel (about one in 20 000 per channel). Deterministic from
/// the seed, and cheap enough for hours at 1 kHz: the hum is tabulated over one period of whole samples when there is one.
/// </summary>
internal sealed class MainsHum
{
    private const double MainsHz = 50.0;
    private const double DropoutProbability = 5e-5;
    private readonly double[] _phase;
    private readonly double _rateHz;
    private readonly ulong _seed;

    public MainsHum(int seed, int channels, double rateHz)
    {
        var random = new Random(seed ^ 0x5eed);
        _phase = Enumerable.Range(0, channels).Select(_ => 2 * Math.PI * random.NextDouble()).ToArray();
        _rateHz = rateHz;
        _seed = (ulong)seed * 0x9E3779B97F4A7C15UL;
    }

    /// <summary>Hum of unit fundamental amplitude on <paramref name="channel"/> at sample <paramref name="sample"/>.</summary>
    public double At(int channel, long sample)
    {
        var w = 2 * Math.PI * MainsHz * (sample / _rateHz);
        return Math.Sin(w + _phase[channel]) + (0.3 * Math.Sin((3 * w) + _phase[channel]));
    }

    /// <summary>Whether the logger missed this cell: a hash of channel and sample, so no generator state is shared.</summary>
    public bool IsDropout(int channel, long sample)
    {
        var h = _seed ^ ((ulong)sample * 0xBF58476D1CE4E5B9UL) ^ ((ulong)(channel + 1) * 0x94D049BB133111EBUL);
        h ^= h >> 31;
        h *= 0xD6E8FEB86479CAF3UL;
        h ^= h >> 29;
        return (h >> 11) * (1.0 / (1UL << 53)) < DropoutProbability;
    }
}
