using System.Globalization;
using MathNet.Numerics.LinearAlgebra;

namespace BcPrep.Uncertainty;

/// <summary>
/// Propagation of distributions by the Monte Carlo method (JCGM 101:2008). Each input is drawn from its
/// <see cref="DistributionKind"/> scaled to its standard uncertainty; inputs with non-zero correlation must be
/// normal and are drawn jointly as x + L·w with L the Cholesky factor of their covariance (an eigen square root
/// when the matrix is only semi-definite, e.g. r = ±1). Runs a fixed number of trials or the adaptive procedure
/// of JCGM 101 7.9.4 with blocks of M = max(⌈100/(1 − p)⌉, 10⁴) trials.
/// </summary>
public static class MonteCarloPropagation
{
    /// <summary>
    /// Runs the model over random input draws. Same seed and inputs give bit-identical results. Throws
    /// <see cref="BcPrepDataException"/> on bad options, size mismatches, correlated non-normal inputs or a
    /// non-finite model output (reported with the trial number).
    /// </summary>
    public static MonteCarloResult Propagate(
        Func<double[], double[]> model,
        IReadOnlyList<UncertaintyInput> inputs,
        IReadOnlyList<string> outputNames,
        CorrelationMatrix? correlation = null,
        MonteCarloOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(inputs);
        ArgumentNullException.ThrowIfNull(outputNames);
        options ??= MonteCarloOptions.Default;
        Validate(inputs, outputNames, correlation, options);
        var sampler = new InputSampler(inputs, correlation, options.Seed);
        var m = outputNames.Count;
        var p = options.CoverageProbability;

        if (options.FixedTrials is int fixedTrials)
        {
            var values = RunBlock(model, sampler, m, fixedTrials, 0);
            return Summarise(values, outputNames, p, fixedTrials, true, options.Seed);
        }

        var blockSize = Math.Max((int)Math.Ceiling(100.0 / (1.0 - p)), 10_000);
        var blocks = new List<double[][]>();
        var blockStats = new List<BlockStatistics[]>();
        while (true)
        {
            var block = RunBlock(model, sampler, m, blockSize, blocks.Count * blockSize);
            blocks.Add(block);
            blockStats.Add(block.Select(v => BlockStatistics.Of(v, p)).ToArray());
            var trials = blocks.Count * blockSize;
            if (blocks.Count >= 2)
            {
                var all = Concatenate(blocks, m);
                if (IsStable(blockStats, all, options.SignificantDigits))
                {
                    return Summarise(all, outputNames, p, trials, true, options.Seed);
                }

                if (trials + blockSize > options.MaxTrials)
                {
                    return Summarise(all, outputNames, p, trials, false, options.Seed);
                }
            }
        }
    }

    /// <summary>Single-output convenience form.</summary>
    public static MonteCarloOutput Propagate(
        Func<double[], double> model,
        IReadOnlyList<UncertaintyInput> inputs,
        string outputName,
        CorrelationMatrix? correlation = null,
        MonteCarloOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(model);
        return Propagate(x => [model(x)], inputs, [outputName], correlation, options).Outputs[0];
    }

    /// <summary>
    /// JCGM 101 7.7: probabilistically symmetric interval from sorted values: q = pM (rounded to the nearest integer when
    /// not whole), r = (M − q)/2 (or (M − q + 1)/2), interval [ỹ_r, ỹ_(r+q)] in 1-based order statistics.
    /// </summary>
    internal static (double Low, double High) SymmetricInterval(double[] sorted, double p)
    {
        var (q, r) = IntervalIndices(sorted.Length, p);
        return (sorted[r - 1], sorted[r + q - 1]);
    }

    /// <summary>JCGM 101 7.7: the shortest interval [ỹ_r, ỹ_(r+q)] over r = 1 … M − q.</summary>
    internal static (double Low, double High) ShortestInterval(double[] sorted, double p)
    {
        var (q, _) = IntervalIndices(sorted.Length, p);
        var best = 0;
        for (var r = 1; r + q < sorted.Length; r++)
        {
            if (sorted[r + q] - sorted[r] < sorted[best + q] - sorted[best])
            {
                best = r;
            }
        }

        return (sorted[best], sorted[best + q]);
    }

    private static (int Q, int R) IntervalIndices(int count, double p)
    {
        var pm = p * count;
        var q = Math.Abs(pm - Math.Round(pm)) < 1e-9 ? (int)Math.Round(pm) : (int)Math.Floor(pm + 0.5);
        q = Math.Min(q, count - 1);
        var r = (count - q) % 2 == 0 ? (count - q) / 2 : (count - q + 1) / 2;
        return (q, Math.Max(r, 1));
    }

    private static void Validate(
        IReadOnlyList<UncertaintyInput> inputs, IReadOnlyList<string> outputNames, CorrelationMatrix? correlation, MonteCarloOptions options)
    {
        if (inputs.Count == 0 || outputNames.Count == 0)
        {
            throw new BcPrepDataException("Monte Carlo propagation needs at least one input and one output.");
        }

        if (correlation is not null && correlation.Size != inputs.Count)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"Correlation matrix has size {correlation.Size} but there are {inputs.Count} inputs."), nameof(correlation));
        }

        if (!(options.CoverageProbability > 0.0 && options.CoverageProbability < 1.0))
        {
            throw new BcPrepDataException($"Coverage probability {options.CoverageProbability} must lie in (0, 1).");
        }

        if (options.FixedTrials is < 2 || options.SignificantDigits < 1 || options.MaxTrials < 2)
        {
            throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                $"Monte Carlo options invalid: trials {options.FixedTrials}, n_dig {options.SignificantDigits}, max trials {options.MaxTrials}."));
        }
    }

    private static double[][] RunBlock(Func<double[], double[]> model, InputSampler sampler, int outputCount, int trials, int firstTrial)
    {
        var values = new double[outputCount][];
        for (var i = 0; i < outputCount; i++)
        {
            values[i] = new double[trials];
        }

        var x = new double[sampler.Count];
        for (var t = 0; t < trials; t++)
        {
            sampler.Fill(x);
            var y = model(x);
            if (y is null || y.Length != outputCount)
            {
                throw new InvalidOperationException(string.Create(CultureInfo.InvariantCulture,
                    $"Model returned {y?.Length ?? 0} outputs in trial {firstTrial + t}, expected {outputCount}."));
            }

            for (var i = 0; i < outputCount; i++)
            {
                if (!double.IsFinite(y[i]))
                {
                    throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                        $"Model output {i} is {y[i]} in Monte Carlo trial {firstTrial + t}; the input distributions reach outside the model's domain."));
                }

                values[i][t] = y[i];
            }
        }

        return values;
    }

    private static double[][] Concatenate(List<double[][]> blocks, int outputCount)
    {
        var all = new double[outputCount][];
        for (var i = 0; i < outputCount; i++)
        {
            all[i] = blocks.SelectMany(b => b[i]).ToArray();
        }

        return all;
    }

    private static bool IsStable(List<BlockStatistics[]> blockStats, double[][] all, int significantDigits)
    {
        var h = blockStats.Count;
        for (var i = 0; i < all.Length; i++)
        {
            var delta = GufValidation.NumericalTolerance(StandardDeviation(all[i], Mean(all[i])), significantDigits);
            var stats = blockStats.Select(b => b[i]).ToArray();
            if (2.0 * SpreadOfAverage(stats.Select(s => s.Mean), h) > delta
                || 2.0 * SpreadOfAverage(stats.Select(s => s.StandardDeviation), h) > delta
                || 2.0 * SpreadOfAverage(stats.Select(s => s.Low), h) > delta
                || 2.0 * SpreadOfAverage(stats.Select(s => s.High), h) > delta)
            {
                return false;
            }
        }

        return true;
    }

    /// <summary>JCGM 101 7.9.4 g): s² = Σ(v_r − v̄)² / [h(h − 1)].</summary>
    private static double SpreadOfAverage(IEnumerable<double> values, int h)
    {
        var v = values.ToArray();
        var mean = v.Average();
        return Math.Sqrt(v.Sum(x => (x - mean) * (x - mean)) / (h * (h - 1.0)));
    }

    private static MonteCarloResult Summarise(double[][] values, IReadOnlyList<string> names, double p, int trials, bool converged, int seed)
    {
        var m = values.Length;
        var means = values.Select(Mean).ToArray();
        var covariance = new double[m, m];
        for (var i = 0; i < m; i++)
        {
            for (var k = 0; k <= i; k++)
            {
                var s = 0.0;
                for (var t = 0; t < trials; t++)
                {
                    s += (values[i][t] - means[i]) * (values[k][t] - means[k]);
                }

                covariance[i, k] = covariance[k, i] = s / (trials - 1.0);
            }
        }

        var outputs = new MonteCarloOutput[m];
        for (var i = 0; i < m; i++)
        {
            var sorted = (double[])values[i].Clone();
            Array.Sort(sorted);
            var (low, high) = SymmetricInterval(sorted, p);
            var (shortLow, shortHigh) = ShortestInterval(sorted, p);
            outputs[i] = new MonteCarloOutput(names[i], means[i], Math.Sqrt(covariance[i, i]), low, high, shortLow, shortHigh, p);
        }

        return new MonteCarloResult(outputs, covariance, trials, converged, seed);
    }

    private static double Mean(double[] v) => v.Average();

    private static double StandardDeviation(double[] v, double mean) =>
        Math.Sqrt(v.Sum(x => (x - mean) * (x - mean)) / (v.Length - 1.0));

    private readonly record struct BlockStatistics(double Mean, double StandardDeviation, double Low, double High)
    {
        public static BlockStatistics Of(double[] values, double p)
        {
            var mean = MonteCarloPropagation.Mean(values);
            var sorted = (double[])values.Clone();
            Array.Sort(sorted);
            var (low, high) = SymmetricInterval(sorted, p);
            return new BlockStatistics(mean, MonteCarloPropagation.StandardDeviation(values, mean), low, high);
        }
    }

    /// <summary>Draws input vectors; holds the seeded stream and the square root of the normal inputs' covariance.</summary>
    private sealed class InputSampler
    {
        private readonly IReadOnlyList<UncertaintyInput> _inputs;
        private readonly Random _random;
        private readonly GaussianSource _gaussian;
        private readonly int[] _normalIndices;
        private readonly double[,] _root;
        private readonly double[] _w;

        public InputSampler(IReadOnlyList<UncertaintyInput> inputs, CorrelationMatrix? correlation, int seed)
        {
            _inputs = inputs;
            _random = new Random(seed);
            _gaussian = new GaussianSource(_random);
            correlation ??= CorrelationMatrix.Identity(inputs.Count);
            for (var i = 0; i < inputs.Count; i++)
            {
                for (var j = 0; j < inputs.Count; j++)
                {
                    if (i != j && correlation[i, j] != 0.0 && inputs[i].Distribution != DistributionKind.Normal)
                    {
                        throw new BcPrepDataException(
                            $"Input '{inputs[i].Name}' is correlated with '{inputs[j].Name}' but has a {inputs[i].Distribution} distribution; only normal inputs can be correlated in the Monte Carlo propagation.");
                    }
                }
            }

            _normalIndices = Enumerable.Range(0, inputs.Count).Where(i => inputs[i].Distribution == DistributionKind.Normal).ToArray();
            _root = SquareRoot(_normalIndices.Select(a => _normalIndices.Select(b => correlation[a, b]).ToArray()).ToArray());
            _w = new double[_normalIndices.Length];
        }

        public int Count => _inputs.Count;

        public void Fill(double[] x)
        {
            for (var a = 0; a < _w.Length; a++)
            {
                _w[a] = _gaussian.Next();
            }

            for (var a = 0; a < _normalIndices.Length; a++)
            {
                var z = 0.0;
                for (var b = 0; b < _w.Length; b++)
                {
                    z += _root[a, b] * _w[b];
                }

                var input = _inputs[_normalIndices[a]];
                x[_normalIndices[a]] = input.Estimate + input.StandardUncertainty * z;
            }

            for (var i = 0; i < _inputs.Count; i++)
            {
                var input = _inputs[i];
                if (input.Distribution != DistributionKind.Normal)
                {
                    x[i] = input.Estimate + input.StandardUncertainty * StandardizedDistributions.Draw(input.Distribution, _random);
                }
            }
        }

        /// <summary>L with L·Lᵀ = R: Cholesky, or Q·√Λ when R is singular (perfect correlations).</summary>
        private static double[,] SquareRoot(double[][] r)
        {
            if (r.Length == 0)
            {
                return new double[0, 0];
            }

            var matrix = Matrix<double>.Build.DenseOfRowArrays(r);
            try
            {
                return matrix.Cholesky().Factor.ToArray();
            }
            catch (ArgumentException)
            {
                var evd = matrix.Evd(Symmetricity.Symmetric);
                var sqrtLambda = Matrix<double>.Build.DiagonalOfDiagonalVector(
                    evd.EigenValues.Map(e => Math.Sqrt(Math.Max(e.Real, 0.0))));
                return (evd.EigenVectors * sqrtLambda).ToArray();
            }
        }
    }
}
