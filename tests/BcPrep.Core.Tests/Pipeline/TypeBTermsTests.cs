using BcPrep.Pipeline;
using BcPrep.Rig;
using BcPrep.Uncertainty;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// The Type B rule the tool applies to each rig-file uncertainty term: every term is its own input (so terms add
/// in quadrature through the model), a limit is turned into u by its distribution, a certificate's U by its k.
/// </summary>
public class TypeBTermsTests
{
    private static readonly ChannelSpec AnyChannel = SampleDayResult.Rig().Channels[0];

    private static UncertaintyTerm Term(UncertaintyTermKind kind, double valueSi, DistributionKind distribution, double k = 2.0) =>
        new(kind, valueSi, k, distribution, double.PositiveInfinity, "test", null);

    [Fact]
    public void Percent_of_reading_is_a_limit_at_the_mean_reading_divided_by_its_distribution()
    {
        // ±0.05 % of reading at 400 Pa: a = 0.2 Pa. JCGM 100 4.3.7: rectangular u = a/√3; 4.3.9: triangular
        // u = a/√6; arcsine u = a/√2 (JCGM 101 6.4.6); a limit read as normal stands for u itself (common practice).
        Assert.Equal(0.2 / Math.Sqrt(3.0), TypeBTerms.StandardUncertainty(Term(UncertaintyTermKind.PercentOfReading, 0.0005, DistributionKind.Rectangular), AnyChannel, -400.0), 12);
        Assert.Equal(0.2 / Math.Sqrt(6.0), TypeBTerms.StandardUncertainty(Term(UncertaintyTermKind.PercentOfReading, 0.0005, DistributionKind.Triangular), AnyChannel, 400.0), 12);
        Assert.Equal(0.2 / Math.Sqrt(2.0), TypeBTerms.StandardUncertainty(Term(UncertaintyTermKind.PercentOfReading, 0.0005, DistributionKind.ArcSine), AnyChannel, 400.0), 12);
        Assert.Equal(0.2, TypeBTerms.StandardUncertainty(Term(UncertaintyTermKind.PercentOfReading, 0.0005, DistributionKind.Normal), AnyChannel, 400.0), 12);
        Assert.Equal(DistributionKind.Triangular, TypeBTerms.Distribution(Term(UncertaintyTermKind.PercentOfReading, 0.0005, DistributionKind.Triangular)));
    }

    [Fact]
    public void Certificate_divides_by_its_coverage_factor_and_resolution_is_rectangular_over_half_a_digit()
    {
        // JCGM 100 4.3.3: u = U/k (1.0 / 2); JCGM 100 F.2.2.1: a resolution δ gives u = δ/√12.
        Assert.Equal(0.5, TypeBTerms.StandardUncertainty(Term(UncertaintyTermKind.Certificate, 1.0, DistributionKind.Rectangular), AnyChannel, 400.0), 12);
        Assert.Equal(DistributionKind.Normal, TypeBTerms.Distribution(Term(UncertaintyTermKind.Certificate, 1.0, DistributionKind.Rectangular)));
        Assert.Equal(0.1 / Math.Sqrt(12.0), TypeBTerms.StandardUncertainty(Term(UncertaintyTermKind.Resolution, 0.1, DistributionKind.Normal), AnyChannel, 400.0), 12);
        Assert.Equal(DistributionKind.Rectangular, TypeBTerms.Distribution(Term(UncertaintyTermKind.Resolution, 0.1, DistributionKind.Normal)));
    }
}
