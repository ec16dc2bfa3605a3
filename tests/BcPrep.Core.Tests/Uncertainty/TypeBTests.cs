using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

public class TypeBTests
{
    [Fact]
    public void Certificate_U_over_k_GUM_4_3_3()
    {
        Assert.Equal(0.05, TypeB.FromCertificate(0.10, 2.0), 15);
    }

    [Fact]
    public void Bounds_conversions_GUM_4_3_7_4_3_9_H_1_3_4_F_2_2_1()
    {
        Assert.Equal(1.0 / Math.Sqrt(3.0), TypeB.FromRectangularHalfWidth(1.0), 15);
        Assert.Equal(1.0 / Math.Sqrt(6.0), TypeB.FromTriangularHalfWidth(1.0), 15);
        Assert.Equal(1.0 / Math.Sqrt(2.0), TypeB.FromArcSineHalfWidth(1.0), 15);
        Assert.Equal(0.1 / Math.Sqrt(12.0), TypeB.FromResolution(0.1), 15);
        // Trapezoid end cases are the triangular (β = 0) and rectangular (β = 1) results (GUM 4.3.9).
        Assert.Equal(TypeB.FromTriangularHalfWidth(2.0), TypeB.FromTrapezoidalHalfWidth(2.0, 0.0), 15);
        Assert.Equal(TypeB.FromRectangularHalfWidth(2.0), TypeB.FromTrapezoidalHalfWidth(2.0, 1.0), 15);
    }

    [Fact]
    public void GUM_H_1_type_B_inputs_match_the_GTC_budget()
    {
        // GUM H.1 via GTC: δθ rectangular half-width 0.05 °C times |c| = l_s·α_s = 575 nm/°C gives 16.599 nm.
        Assert.Equal(16.599, 575.0 * TypeB.FromRectangularHalfWidth(0.05), 3);
        // Arcsine half-width 0.5 °C combined with u(θ̄) = 0.2 °C gives u(θ) = 0.4062 °C (reference sheet 3.2(c), [CC]).
        Assert.Equal(0.4062, Math.Sqrt(0.04 + Math.Pow(TypeB.FromArcSineHalfWidth(0.5), 2)), 4);
    }

    [Theory]
    [InlineData(0.25, 8.0)] // GUM G.4.2 example
    [InlineData(0.10, 50.0)] // GUM H.1 (δα)
    [InlineData(0.50, 2.0)] // GUM H.1 (δθ)
    public void Degrees_of_freedom_from_reliability_GUM_eq_G_3(double relative, double expected)
    {
        Assert.Equal(expected, TypeB.DegreesOfFreedomFromRelativeReliability(relative), 10);
    }

    [Fact]
    public void Exactly_reliable_u_has_infinite_degrees_of_freedom()
    {
        Assert.Equal(double.PositiveInfinity, TypeB.DegreesOfFreedomFromRelativeReliability(0.0));
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(-1.0)]
    [InlineData(double.PositiveInfinity)]
    public void Invalid_half_widths_throw(double a)
    {
        Assert.Throws<BcPrepDataException>(() => TypeB.FromRectangularHalfWidth(a));
    }

    [Fact]
    public void Zero_coverage_factor_throws()
    {
        Assert.Throws<BcPrepDataException>(() => TypeB.FromCertificate(1.0, 0.0));
    }

    [Fact]
    public void Input_rejects_negative_uncertainty_and_zero_dof()
    {
        Assert.Throws<BcPrepDataException>(() => new UncertaintyInput("x", 1.0, -0.1));
        Assert.Throws<BcPrepDataException>(() => new UncertaintyInput("x", 1.0, 0.1, 0.0));
        Assert.Throws<BcPrepDataException>(() => new UncertaintyInput("x", double.NaN, 0.1));
    }
}
