using BcPrep.Steady;

namespace BcPrep.Tests.Steady;

public class SettlingEstimateTests
{
    /// <summary>A noise-free first-order approach: 20 → 60 after a step at 100 s, τ = 300 s, sampled each second.</summary>
    private static (double[] T, double[] Y) Approach(double tauS = 300.0, double noiseSd = 0.0, double driftPerS = 0.0)
    {
        var n = 3000;
        var t = Enumerable.Range(0, n).Select(i => 100.0 + i).ToArray();
        var noise = noiseSd > 0 ? SteadyTestData.Ar1(n, 0.7, noiseSd, 5) : new double[n];
        var y = t.Select((ti, i) => 60.0 - (40.0 * Math.Exp(-(ti - 100.0) / tauS)) + (driftPerS * (ti - 100.0)) + noise[i]).ToArray();
        return (t, y);
    }

    [Fact]
    public void Fit_of_an_exact_first_order_approach_recovers_tau_asymptote_and_amplitude()
    {
        // Known answer by construction: y = 60 − 40·exp(−(t − 100)/300).
        var (t, y) = Approach();
        var fit = SettlingEstimate.Fit(t, y, 100.0, 1.0, 12000.0);
        Assert.Equal(300.0, fit.TauS, 3);
        Assert.Equal(60.0, fit.Asymptote, 4);
        Assert.Equal(-40.0, fit.Amplitude, 4);
        Assert.False(fit.TauAtBound);
    }

    [Fact]
    public void Remaining_change_is_slope_times_tau_and_settled_since_solves_it_for_the_tolerance()
    {
        // Definition: remaining = |A|·exp(−Δt/τ) = |dy/dt|·τ; settled when it reaches the tolerance:
        // t = 100 + 300·ln(40/0.2) = 100 + 1589.5 s.
        var (t, y) = Approach();
        var fit = SettlingEstimate.Fit(t, y, 100.0, 1.0, 12000.0);
        Assert.Equal(Math.Abs(fit.SlopeAt(700.0)) * fit.TauS, fit.RemainingChangeAt(700.0), 9);
        Assert.Equal(40.0 * Math.Exp(-2.0), fit.RemainingChangeAt(700.0), 5);
        Assert.Equal(100.0 + (300.0 * Math.Log(40.0 / 0.2)), fit.SettledSinceS(0.2), 2);
    }

    [Fact]
    public void Slow_channel_with_a_small_slope_is_still_far_from_its_asymptote()
    {
        // The example: τ = 8 min and a slope of 0.1 K/min are 0.8 K from the asymptote.
        var fit = new SettlingFit(0.0, 100.0, -0.8, 480.0, 0.0, 100, false);
        Assert.Equal(0.1 / 60.0, fit.SlopeAt(0.0), 12);
        Assert.Equal(0.8, fit.RemainingChangeAt(0.0), 12);
    }

    [Fact]
    public void Autocorrelated_noise_leaves_tau_within_two_percent()
    {
        // AR(1) φ = 0.7, σ = 0.05 on a 40 K approach; tolerance of the check: 2 % (common practice for this test).
        var (t, y) = Approach(noiseSd: 0.05);
        var fit = SettlingEstimate.Fit(t, y, 100.0, 1.0, 12000.0);
        Assert.InRange(fit.TauS, 294.0, 306.0);
    }

    [Fact]
    public void Drift_term_keeps_tau_when_the_room_drifts_under_the_approach()
    {
        // 0.2 K/h of ambient drift under the same approach: with the drift term τ stays 300 s, and the settled moment
        // is judged against the value at the plateau's end.
        var (t, y) = Approach(driftPerS: 0.2 / 3600.0);
        var fit = SettlingEstimate.Fit(t, y, 100.0, 1.0, 12000.0, withDrift: true);
        Assert.Equal(300.0, fit.TauS, 2);
        Assert.Equal(0.2 / 3600.0, fit.DriftPerS, 9);
        var settled = fit.SettledSinceS(0.2, t[^1]);
        Assert.True(Math.Abs(fit.ValueAt(settled) - fit.ValueAt(t[^1])) <= 0.2 + 1e-9);
        Assert.True(Math.Abs(fit.ValueAt(settled - 5) - fit.ValueAt(t[^1])) > 0.2);
    }

    [Fact]
    public void Gaps_are_skipped_and_do_not_change_the_fit()
    {
        var (t, y) = Approach();
        for (var i = 400; i < 405; i++)
        {
            y[i] = double.NaN;
        }
        var fit = SettlingEstimate.Fit(t, y, 100.0, 1.0, 12000.0);
        Assert.Equal(300.0, fit.TauS, 3);
        Assert.Equal(3000 - 5, fit.Count);
    }
}
