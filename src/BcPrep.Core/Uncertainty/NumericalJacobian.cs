using System.Globalization;

namespace BcPrep.Uncertainty;

/// <summary>
/// Sensitivity coefficients cᵢⱼ = ∂fᵢ/∂xⱼ of a multi-output model by central differences
/// (f(x + hⱼ) − f(x − hⱼ)) / 2hⱼ.
/// </summary>
/// <remarks>
/// Step rule hⱼ = max(|xⱼ|·1e-6, u(xⱼ)·1e-3), or 1e-6 when both are zero. Why: the central-difference error is
/// truncation ~h²·f‴/6 plus round-off ~ε·|f|/h; with h ≈ 1e-6 of the quantity's own scale both stay near
/// 1e-12 and 1e-10 relative, well under the 1e-8 target (ε^(1/3) ≈ 6e-6 is the textbook optimum). Scaling with
/// |x| alone fails for estimates that are zero (an error term such as δθ = 0), so the step never falls below
/// 1e-3·u, which is also small against the range over which the linearisation is meant to hold (±u). The step
/// is rounded so that x + h is exactly representable ((x + h) − x), removing one round-off source.
/// </remarks>
public static class NumericalJacobian
{
    /// <summary>Relative step factor applied to |x|.</summary>
    public const double RelativeStep = 1e-6;

    /// <summary>Step factor applied to u(x).</summary>
    public const double UncertaintyStep = 1e-3;

    /// <summary>Step used when x and u(x) are both zero.</summary>
    public const double FallbackStep = 1e-6;

    /// <summary>The step hⱼ for an input with estimate x and standard uncertainty u (rule in the remarks).</summary>
    public static double StepFor(double estimate, double standardUncertainty)
    {
        var h = Math.Max(Math.Abs(estimate) * RelativeStep, standardUncertainty * UncertaintyStep);
        if (h == 0.0)
        {
            h = FallbackStep;
        }

        var representable = (estimate + h) - estimate;
        return representable > 0.0 ? representable : h;
    }

    /// <summary>
    /// Evaluates the model at the estimates (returned as <paramref name="outputs"/>) and the m × n Jacobian.
    /// Throws <see cref="BcPrepDataException"/> when the model returns a non-finite value or changes its output length.
    /// </summary>
    public static double[,] Evaluate(
        Func<double[], double[]> model,
        IReadOnlyList<double> estimates,
        IReadOnlyList<double> standardUncertainties,
        out double[] outputs)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(estimates);
        ArgumentNullException.ThrowIfNull(standardUncertainties);
        var n = estimates.Count;
        var x = estimates.ToArray();
        outputs = CheckedCall(model, x, -1);
        var m = outputs.Length;
        var jacobian = new double[m, n];
        for (var j = 0; j < n; j++)
        {
            var h = StepFor(x[j], standardUncertainties[j]);
            var xj = x[j];
            x[j] = xj + h;
            var plus = CheckedCall(model, x, j);
            x[j] = xj - h;
            var minus = CheckedCall(model, x, j);
            x[j] = xj;
            if (plus.Length != m || minus.Length != m)
            {
                throw new InvalidOperationException("Measurement model changed its number of outputs between evaluations.");
            }

            for (var i = 0; i < m; i++)
            {
                jacobian[i, j] = (plus[i] - minus[i]) / (2.0 * h);
            }
        }

        return jacobian;
    }

    private static double[] CheckedCall(Func<double[], double[]> model, double[] x, int perturbed)
    {
        var y = model((double[])x.Clone());
        if (y is null || y.Length == 0)
        {
            throw new InvalidOperationException("Measurement model returned no outputs.");
        }

        for (var i = 0; i < y.Length; i++)
        {
            if (!double.IsFinite(y[i]))
            {
                var where = perturbed < 0
                    ? "at the input estimates"
                    : string.Create(CultureInfo.InvariantCulture, $"when input {perturbed} was perturbed for its derivative");
                throw new BcPrepDataException(string.Create(CultureInfo.InvariantCulture,
                    $"Measurement model output {i} is {y[i]} {where}."));
            }
        }

        return y;
    }
}
