using System.Globalization;

namespace BcPrep.Uncertainty;

/// <summary>
/// First-order GUM law of propagation of uncertainty (JCGM 100 5.1.2 eq. 10, 5.2.2 eq. 13) in matrix form
/// U_y = J U_x Jᵀ for a model with several outputs, so that correlations between outputs come with it.
/// Sensitivities come from <see cref="NumericalJacobian"/>; effective degrees of freedom from Welch–Satterthwaite
/// (GUM G.4.1) or the conservative rule of <see cref="DegreesOfFreedomRule.ConservativeCorrelated"/>; coverage
/// factors from Student's t (<see cref="CoverageFactor"/>).
/// </summary>
/// <remarks>First order only: for models that are strongly non-linear within ±u (e.g. a product with a factor
/// estimated as zero, JCGM 101 9.3) use <see cref="MonteCarloPropagation"/> and its validation.</remarks>
public static class GumPropagation
{
    /// <summary>
    /// Propagates the inputs through a multi-output model. <paramref name="model"/> maps input values (in the order of
    /// <paramref name="inputs"/>) to outputs (in the order of <paramref name="outputNames"/>); it must be deterministic
    /// and may not keep the array it is given. <paramref name="correlation"/> = null means uncorrelated inputs.
    /// Throws <see cref="BcPrepDataException"/> on size mismatches, an invalid probability or a non-finite model output.
    /// </summary>
    public static GumResult Propagate(
        Func<double[], double[]> model,
        IReadOnlyList<UncertaintyInput> inputs,
        IReadOnlyList<string> outputNames,
        CorrelationMatrix? correlation = null,
        double coverageProbability = 0.95)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(inputs);
        ArgumentNullException.ThrowIfNull(outputNames);
        if (inputs.Count == 0)
        {
            throw new ArgumentException("Uncertainty propagation needs at least one input.", nameof(inputs));
        }

        correlation ??= CorrelationMatrix.Identity(inputs.Count);
        if (correlation.Size != inputs.Count)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"Correlation matrix has size {correlation.Size} but there are {inputs.Count} inputs."), nameof(correlation));
        }

        var u = inputs.Select(i => i.StandardUncertainty).ToArray();
        var jacobian = NumericalJacobian.Evaluate(model, inputs.Select(i => i.Estimate).ToArray(), u, out var y);
        if (y.Length != outputNames.Count)
        {
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"Model returned {y.Length} outputs but {outputNames.Count} output names were given."), nameof(outputNames));
        }

        var covariance = Sandwich(jacobian, correlation.ToCovariance(u));
        var outputs = new GumOutput[y.Length];
        for (var i = 0; i < y.Length; i++)
        {
            outputs[i] = BuildOutput(outputNames[i], y[i], i, jacobian, covariance[i, i], inputs, correlation, coverageProbability);
        }

        return new GumResult(inputs.ToArray(), correlation, outputs, jacobian, covariance, ToCorrelation(covariance));
    }

    /// <summary>Single-output convenience form of <see cref="Propagate(Func{double[], double[]}, IReadOnlyList{UncertaintyInput}, IReadOnlyList{string}, CorrelationMatrix?, double)"/>.</summary>
    public static GumOutput Propagate(
        Func<double[], double> model,
        IReadOnlyList<UncertaintyInput> inputs,
        string outputName,
        CorrelationMatrix? correlation = null,
        double coverageProbability = 0.95)
    {
        ArgumentNullException.ThrowIfNull(model);
        return Propagate(x => [model(x)], inputs, [outputName], correlation, coverageProbability).Outputs[0];
    }

    private static GumOutput BuildOutput(
        string name,
        double estimate,
        int row,
        double[,] jacobian,
        double variance,
        IReadOnlyList<UncertaintyInput> inputs,
        CorrelationMatrix correlation,
        double coverageProbability)
    {
        var n = inputs.Count;
        var contributions = new double[n];
        var diagonalVariance = 0.0;
        for (var j = 0; j < n; j++)
        {
            contributions[j] = jacobian[row, j] * inputs[j].StandardUncertainty;
            diagonalVariance += contributions[j] * contributions[j];
        }

        // Round-off can leave a tiny negative variance when correlations cancel exactly (y = x1 − x2, r = 1).
        variance = Math.Max(variance, 0.0);
        var uc = Math.Sqrt(variance);
        var budget = new BudgetLine[n];
        for (var j = 0; j < n; j++)
        {
            var input = inputs[j];
            budget[j] = new BudgetLine(input.Name, input.Estimate, input.StandardUncertainty, input.DegreesOfFreedom,
                input.Distribution, input.Evaluation, input.Source, jacobian[row, j], contributions[j],
                variance > 0.0 ? contributions[j] * contributions[j] / variance : 0.0);
        }

        var correlationVariance = variance - diagonalVariance;
        var (nuEff, rule) = EffectiveDegreesOfFreedom(uc, contributions, inputs, correlation);
        var nu = TruncateDegreesOfFreedom(nuEff);
        var k = CoverageFactor.ForStudentT(nu, coverageProbability);
        return new GumOutput(name, estimate, uc, budget, correlationVariance,
            variance > 0.0 ? correlationVariance / variance : 0.0,
            nuEff, nu, rule, coverageProbability, k, k * uc);
    }

    /// <summary>
    /// ν_eff = u_c⁴ / Σ uᵢ⁴(y)/νᵢ (GUM G.2b); with correlated contributing inputs the minimum of that and the
    /// smallest ν among those inputs (documented conservative choice, see <see cref="DegreesOfFreedomRule"/>).
    /// </summary>
    internal static (double Nu, DegreesOfFreedomRule Rule) EffectiveDegreesOfFreedom(
        double combinedUncertainty,
        IReadOnlyList<double> contributions,
        IReadOnlyList<UncertaintyInput> inputs,
        CorrelationMatrix correlation)
    {
        var denominator = 0.0;
        for (var j = 0; j < contributions.Count; j++)
        {
            var nuJ = inputs[j].DegreesOfFreedom;
            if (contributions[j] != 0.0 && !double.IsPositiveInfinity(nuJ))
            {
                denominator += Math.Pow(contributions[j], 4) / nuJ;
            }
        }

        var uc4 = Math.Pow(combinedUncertainty, 4);
        var nuWs = denominator > 0.0 ? uc4 / denominator : double.PositiveInfinity;
        if (combinedUncertainty == 0.0 && denominator > 0.0)
        {
            // Fully cancelling correlated contributions: nothing uncertain is left, so no t-widening is needed.
            nuWs = double.PositiveInfinity;
        }

        var minCorrelatedNu = double.PositiveInfinity;
        var anyCorrelated = false;
        for (var j = 0; j < contributions.Count; j++)
        {
            for (var l = 0; l < contributions.Count; l++)
            {
                if (l != j && contributions[j] != 0.0 && contributions[l] != 0.0 && correlation[j, l] != 0.0)
                {
                    anyCorrelated = true;
                    minCorrelatedNu = Math.Min(minCorrelatedNu, inputs[j].DegreesOfFreedom);
                }
            }
        }

        if (anyCorrelated && combinedUncertainty > 0.0)
        {
            return (Math.Min(nuWs, minCorrelatedNu), DegreesOfFreedomRule.ConservativeCorrelated);
        }

        return double.IsPositiveInfinity(nuWs)
            ? (nuWs, DegreesOfFreedomRule.Infinite)
            : (nuWs, DegreesOfFreedomRule.WelchSatterthwaite);
    }

    /// <summary>GUM G.6.4: truncate ν_eff to the next lower integer (but not below 1); +∞ stays +∞.</summary>
    internal static double TruncateDegreesOfFreedom(double nuEff) =>
        double.IsPositiveInfinity(nuEff) ? nuEff : Math.Max(1.0, Math.Floor(nuEff));

    private static double[,] Sandwich(double[,] j, double[,] ux)
    {
        var m = j.GetLength(0);
        var n = j.GetLength(1);
        var jux = new double[m, n];
        for (var i = 0; i < m; i++)
        {
            for (var b = 0; b < n; b++)
            {
                var s = 0.0;
                for (var a = 0; a < n; a++)
                {
                    s += j[i, a] * ux[a, b];
                }

                jux[i, b] = s;
            }
        }

        var uy = new double[m, m];
        for (var i = 0; i < m; i++)
        {
            for (var k = 0; k <= i; k++)
            {
                var s = 0.0;
                for (var b = 0; b < n; b++)
                {
                    s += jux[i, b] * j[k, b];
                }

                uy[i, k] = uy[k, i] = s;
            }
        }

        return uy;
    }

    private static double[,] ToCorrelation(double[,] covariance)
    {
        var m = covariance.GetLength(0);
        var r = new double[m, m];
        for (var i = 0; i < m; i++)
        {
            for (var k = 0; k < m; k++)
            {
                var denominator = Math.Sqrt(Math.Max(covariance[i, i], 0.0) * Math.Max(covariance[k, k], 0.0));
                r[i, k] = denominator > 0.0 ? Math.Clamp(covariance[i, k] / denominator, -1.0, 1.0) : double.NaN;
            }
        }

        return r;
    }
}
