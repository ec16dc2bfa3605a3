using System.Globalization;

namespace BcPrep.Uncertainty;

/// <summary>
/// Latin hypercube sample of independent inputs (McKay, Beckman &amp; Conover 1979): each input's probability
/// range is cut into <c>count</c> equal strata, each stratum is hit exactly once, at a uniformly random point
/// within it, and strata are paired across inputs by independent random permutations. Values are
/// x + u·F⁻¹(p) with F the standardized shape of the input's <see cref="DistributionKind"/>. Seeded and
/// reproducible. Correlations are not imposed (use <see cref="MonteCarloPropagation"/> for correlated inputs).
/// </summary>
public static class LatinHypercube
{
    /// <summary>
    /// Returns <paramref name="count"/> rows, each holding one value per input (input order, input units).
    /// count ≥ 1, otherwise <see cref="BcPrepDataException"/>.
    /// </summary>
    public static double[][] Sample(IReadOnlyList<UncertaintyInput> inputs, int count, int seed)
    {
        ArgumentNullException.ThrowIfNull(inputs);
        if (count < 1)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Latin hypercube sample size {count} must be ≥ 1."));
        }

        var random = new Random(seed);
        var rows = new double[count][];
        for (var i = 0; i < count; i++)
        {
            rows[i] = new double[inputs.Count];
        }

        var strata = Enumerable.Range(0, count).ToArray();
        for (var j = 0; j < inputs.Count; j++)
        {
            random.Shuffle(strata);
            var input = inputs[j];
            for (var i = 0; i < count; i++)
            {
                var offset = random.NextDouble();
                if (offset == 0.0)
                {
                    offset = 0.5; // keeps p inside (0, 1) so the normal inverse CDF stays finite
                }

                var p = (strata[i] + offset) / count;
                rows[i][j] = input.Estimate + input.StandardUncertainty * StandardizedDistributions.InverseCdf(input.Distribution, p);
            }
        }

        return rows;
    }
}
