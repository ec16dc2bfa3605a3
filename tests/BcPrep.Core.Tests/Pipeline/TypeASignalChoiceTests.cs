using BcPrep.Conditioning;
using BcPrep.Tests.Uncertainty;
using BcPrep.Uncertainty;
using Xunit.Abstractions;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// Why the window mean and its Type A uncertainty come from unfiltered samples. A low-pass with unit DC gain does
/// not change what is known about the mean, but it removes the high-frequency part of the scatter: the standard
/// deviation and the naive s/√n shrink at any cutoff, and the autocorrelation correction can only win this back
/// while the filter's correlation time is short against the window. With a cutoff of 1 % of the sample rate it does
/// not: the filtered Type A is about a third too small (own measurement with this seed; at 5 % it still recovers).
/// </summary>
public class TypeASignalChoiceTests(ITestOutputHelper output)
{
    [Fact]
    public void Low_pass_filtered_samples_understate_the_Type_A_uncertainty_of_an_AR1_window()
    {
        const int n = 6000;
        const double phi = 0.5;
        const double fs = 10.0;
        var x = Ar1.Series(n, phi, new Random(20261124), mean: 100.0);
        var lowPass = ButterworthDesign.LowPass(4, 0.1, fs).Sections;
        var filtered = ZeroPhaseFilter.ForwardBackwardPadded(lowPass, x, ZeroPhaseFilter.SettlingPadLength(lowPass));

        var raw = WindowMean.Evaluate(x);
        var smooth = WindowMean.Evaluate(filtered);
        // Exact for AR(1) with unit innovations: var(mean) = γ_n σ²/n, σ² = 1/(1 − φ²) (reference sheet 4.1).
        var exact = Math.Sqrt(Ar1.ExactGamma(n, phi) / (1 - (phi * phi)) / n);
        output.WriteLine($"exact {exact:G4}; unfiltered u {raw.StandardUncertainty:G4} (naive {raw.NaiveStandardUncertainty:G4}, s {raw.StandardDeviation:G4}); " +
                         $"filtered u {smooth.StandardUncertainty:G4} (naive {smooth.NaiveStandardUncertainty:G4}, s {smooth.StandardDeviation:G4})");

        Assert.Equal(raw.Mean, smooth.Mean, 2);                                  // unit DC gain: the same mean
        Assert.InRange(raw.StandardUncertainty / exact, 0.8, 1.25);              // unfiltered: honest
        Assert.True(smooth.StandardDeviation < 0.5 * raw.StandardDeviation);     // the scatter is narrowed …
        Assert.True(smooth.NaiveStandardUncertainty < 0.25 * raw.NaiveStandardUncertainty);
        Assert.True(smooth.StandardUncertainty < 0.8 * exact);                   // … and the Type A understated
        Assert.True(smooth.StandardUncertainty < 0.8 * raw.StandardUncertainty);
    }
}
