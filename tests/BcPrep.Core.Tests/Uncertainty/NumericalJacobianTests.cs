using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

public class NumericalJacobianTests
{
    [Fact]
    public void Central_differences_match_analytic_derivatives_to_1e_8_relative()
    {
        // Smooth model with analytic derivatives (calculus, no external source needed).
        static double[] Model(double[] x) => [Math.Exp(x[0]) * Math.Sin(x[1]) / x[2], x[0] * x[0] * x[2] + Math.Log(x[1])];
        double[] x = [1.3, 0.7, 2.5];
        double[] u = [0.01, 0.002, 0.05];
        var j = NumericalJacobian.Evaluate(Model, x, u, out var y);
        var e = Math.Exp(1.3);
        double[,] expected =
        {
            { e * Math.Sin(0.7) / 2.5, e * Math.Cos(0.7) / 2.5, -e * Math.Sin(0.7) / (2.5 * 2.5) },
            { 2 * 1.3 * 2.5, 1.0 / 0.7, 1.3 * 1.3 },
        };
        Assert.Equal(Model(x)[0], y[0]);
        for (var i = 0; i < 2; i++)
        {
            for (var k = 0; k < 3; k++)
            {
                Assert.True(Math.Abs(j[i, k] / expected[i, k] - 1.0) < 1e-8, $"J[{i},{k}] = {j[i, k]} vs {expected[i, k]}");
            }
        }
    }

    [Fact]
    public void Zero_estimate_uses_the_uncertainty_scaled_step()
    {
        // ∂/∂x of x·exp(x) at 0 is 1; the step comes from u because |x| = 0.
        var j = NumericalJacobian.Evaluate(x => [x[0] * Math.Exp(x[0])], [0.0], [0.3], out _);
        Assert.Equal(3e-4, NumericalJacobian.StepFor(0.0, 0.3), 12);
        Assert.True(Math.Abs(j[0, 0] - 1.0) < 1e-7);
    }

    [Fact]
    public void Large_offset_quantity_keeps_its_derivative()
    {
        // An end gauge of 5e7 nm: ∂(x²)/∂x = 2x must survive the large magnitude.
        var j = NumericalJacobian.Evaluate(x => [x[0] * x[0]], [5e7], [25.0], out _);
        Assert.True(Math.Abs(j[0, 0] / 1e8 - 1.0) < 1e-8);
    }

    [Fact]
    public void Non_finite_model_output_throws()
    {
        Assert.Throws<BcPrepDataException>(() => NumericalJacobian.Evaluate(x => [Math.Sqrt(x[0])], [0.0], [0.1], out _));
    }
}
