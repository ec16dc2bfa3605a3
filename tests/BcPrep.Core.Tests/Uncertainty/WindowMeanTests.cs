using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

public class WindowMeanTests
{
    [Theory]
    [InlineData(100, 0.5, 2.960000)]
    [InlineData(1000, 0.9, 18.820000)]
    [InlineData(50, 0.8, 8.200011)]
    [InlineData(10, 0.5, 2.600391)]
    public void Exact_AR1_gamma_reference_sheet_4_2(int n, double phi, double expected)
    {
        // The closed form used by the statistical tests below reproduces the sheet's [CC] table, and so does the
        // definitional sum 1 + 2Σ(1 − k/n)φᵏ that the estimator applies to ρ̂(k).
        Assert.Equal(expected, Ar1.ExactGamma(n, phi), 5);
        var sum = 1.0;
        for (var k = 1; k < n; k++)
        {
            sum += 2.0 * (1.0 - (double)k / n) * Math.Pow(phi, k);
        }

        Assert.Equal(expected, sum, 5);
    }

    [Theory]
    [InlineData(AutocorrelationCutoff.SokalWindow, 0.05)]
    [InlineData(AutocorrelationCutoff.BartlettBand, 0.12)]
    public void Estimated_gamma_of_AR1_phi_08_is_close_to_exact_reference_sheet_4_2(AutocorrelationCutoff cutoff, double tolerance)
    {
        // Sheet 4.2: φ = 0.8, n = 10 000, many seeds; mean estimate within a few % of 9 (statistical tolerance).
        // The Bartlett-band cut-off drops the tail inside the band, so it is allowed more (and is biased low).
        var random = new Random(20060901);
        var exact = Ar1.ExactGamma(10_000, 0.8);
        var estimates = Enumerable.Range(0, 30)
            .Select(_ => WindowMean.Evaluate(Ar1.Series(10_000, 0.8, random), new WindowMeanOptions(cutoff)).IntegratedAutocorrelation)
            .ToArray();
        Assert.InRange(estimates.Average() / exact, 1.0 - tolerance, 1.0 + 0.05);
    }

    [Fact]
    public void Naive_s_over_root_n_understates_by_root_gamma_for_phi_09_reference_sheet_4_2()
    {
        var random = new Random(42);
        var ratios = Enumerable.Range(0, 20)
            .Select(_ => WindowMean.Evaluate(Ar1.Series(20_000, 0.9, random)))
            .Select(r => r.StandardUncertainty / r.NaiveStandardUncertainty)
            .ToArray();
        // √18.8 ≈ 4.3 for n = 1000; for long series √((1+φ)/(1−φ)) = √19 ≈ 4.36.
        Assert.InRange(ratios.Average(), 4.36 * 0.93, 4.36 * 1.05);
    }

    [Fact]
    public void Empirical_coverage_of_95_percent_intervals_AR1_phi_08()
    {
        // Common practice check: 1000 seeded windows, n = 2000, true mean 10. The autocorrelation-aware interval must
        // cover the truth in 93–97 % of windows, the naive s/√n interval visibly fails (< 80 %).
        var random = new Random(7);
        const double trueMean = 10.0;
        var covered = 0;
        var naiveCovered = 0;
        const int windows = 1000;
        for (var w = 0; w < windows; w++)
        {
            var r = WindowMean.Evaluate(Ar1.Series(2000, 0.8, random, trueMean));
            var error = Math.Abs(r.Mean - trueMean);
            covered += error <= r.ExpandedUncertainty(0.95) ? 1 : 0;
            naiveCovered += error <= CoverageFactor.ForStudentT(r.NaiveDegreesOfFreedom) * r.NaiveStandardUncertainty ? 1 : 0;
        }

        Assert.InRange((double)covered / windows, 0.93, 0.97);
        Assert.True((double)naiveCovered / windows < 0.80, $"naive coverage {naiveCovered}/{windows}");
    }

    [Fact]
    public void White_noise_gives_about_the_naive_uncertainty()
    {
        var random = new Random(3);
        var r = WindowMean.Evaluate(Ar1.Series(5000, 0.0, random));
        Assert.InRange(r.StandardUncertainty / r.NaiveStandardUncertainty, 1.0, 1.1);
        Assert.True(r.IntegratedAutocorrelation >= 1.0);
    }

    [Fact]
    public void Fewer_than_three_samples_throw()
    {
        Assert.Throws<BcPrepDataException>(() => WindowMean.Evaluate([1.0, 2.0]));
    }

    [Fact]
    public void NaN_sample_throws()
    {
        Assert.Throws<BcPrepDataException>(() => WindowMean.Evaluate([1.0, double.NaN, 2.0, 3.0]));
    }

    [Fact]
    public void Stuck_channel_gives_zero_uncertainty_with_flag_not_NaN()
    {
        var r = WindowMean.Evaluate(Enumerable.Repeat(0.1, 1000).ToArray());
        Assert.True(r.IsConstant);
        Assert.Equal(0.1, r.Mean);
        Assert.Equal(0.0, r.StandardUncertainty);
        Assert.Equal(0.0, r.ExpandedUncertainty());
    }

    [Fact]
    public void Sokal_window_stops_at_the_first_lag_reaching_c_gamma()
    {
        // ρ = 0.5 at lag 1 only, n = 1000: γ(M) = 1 + 2·0.999·0.5 = 1.999 for M ≥ 1; first M ≥ 5·1.999 is 10 (Sokal 1997 rule).
        var rho = new double[1000];
        rho[0] = 1.0;
        rho[1] = 0.5;
        var (m, gamma, converged) = WindowMean.SokalWindow(rho, 1000, 5.0);
        Assert.Equal(10, m);
        Assert.Equal(1.999, gamma, 12);
        Assert.True(converged);
    }

    [Fact]
    public void Sokal_window_reports_non_convergence()
    {
        // ρ = 1 at all lags of a 5-sample window: γ = 1 + 2(0.8 + 0.6 + 0.4 + 0.2) = 5 and M ≥ 5γ is never met.
        var (m, gamma, converged) = WindowMean.SokalWindow([1, 1, 1, 1, 1], 5, 5.0);
        Assert.False(converged);
        Assert.Equal(4, m);
        Assert.Equal(5.0, gamma, 12);
    }

    [Fact]
    public void One_million_AR1_samples_give_the_integrated_autocorrelation_time_1_plus_phi_over_1_minus_phi()
    {
        // Speed is measured in benchmarks, never asserted here (DEVELOPERS.md): a shared CI machine made a 5 s bound flaky.
        var x = Ar1.Series(1_000_000, 0.9, new Random(11));
        var r = WindowMean.Evaluate(x);
        Assert.InRange(r.IntegratedAutocorrelation, 19.0 * 0.9, 19.0 * 1.1);
    }
}
