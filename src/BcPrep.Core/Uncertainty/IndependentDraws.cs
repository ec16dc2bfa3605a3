namespace BcPrep.Uncertainty;

/// <summary>
/// One random draw of a vector of mutually independent inputs, each from its <see cref="DistributionKind"/>
/// scaled to its standard uncertainty (x + u·z, JCGM 101 6.4), on a stream of its own seed. Giving every draw its
/// own seed makes any single draw reproducible on its own, and keeps the first draws of an ensemble unchanged
/// when more are asked for. Use <see cref="MonteCarloPropagation"/> when inputs are correlated.
/// </summary>
public static class IndependentDraws
{
    /// <summary>One vector of input values (input order, input units); an input with u = 0 stays at its estimate.</summary>
    public static double[] Draw(IReadOnlyList<UncertaintyInput> inputs, int seed)
    {
        ArgumentNullException.ThrowIfNull(inputs);
        var random = new Random(seed);
        var gaussian = new GaussianSource(random);
        var x = new double[inputs.Count];
        for (var i = 0; i < inputs.Count; i++)
        {
            var input = inputs[i];
            var z = input.Distribution == DistributionKind.Normal ? gaussian.Next() : StandardizedDistributions.Draw(input.Distribution, random);
            x[i] = input.Estimate + (input.StandardUncertainty * z);
        }

        return x;
    }

    /// <summary>
    /// The seed of draw <paramref name="index"/> of a set seeded with <paramref name="seed"/>: a SplitMix64 mix of
    /// both, folded to a non-negative int, so that neighbouring draws get unrelated streams.
    /// </summary>
    public static int SeedOf(int seed, int index)
    {
        var z = unchecked(((ulong)(uint)seed << 32) + (uint)index + 0x9E3779B97F4A7C15UL);
        z = unchecked((z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL);
        z = unchecked((z ^ (z >> 27)) * 0x94D049BB133111EBUL);
        z ^= z >> 31;
        return (int)(z & 0x7FFFFFFF);
    }
}
