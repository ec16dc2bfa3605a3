namespace BcPrep.Calibration;

/// <summary>
/// Removes the NIST inverse polynomial's error from a thermocouple's window mean, so that the boundary conditions
/// rest on the exact inverse of the ITS-90 reference function (NIST Monograph 175).
/// </summary>
/// <remarks>
/// The samples of a day are converted by the inverse polynomial t(E), which is fast and vectorised but departs from
/// the reference function by up to its published error band (type K: −0.05 … +0.06 °C). With h(T) = t(E(T)) − T the
/// polynomial's error at the true temperature T, a sample reads T + h(T), so the exact window mean is
/// T̄ = T̄_poly − mean h(Tᵢ). h varies slowly, so mean h(Tᵢ) = h(T̄) up to ½ h″ s² (s the window's standard
/// deviation). The correction is −h(T̄), found by two fixed-point steps. The half-width of its (rectangular)
/// uncertainty is ½ |h″| (2s)², four times the expected remainder, from a central second difference of h over ±2s:
/// about 2e-4 K for s = 1 K, and far less for a steady window.
/// </remarks>
/// <param name="CorrectionK">Add to the polynomial window mean to get the exact-inverse mean (K).</param>
/// <param name="RemainderHalfWidthK">Bound of what the one-point correction leaves (K), rectangular.</param>
public sealed record InversePolynomialCorrection(double CorrectionK, double RemainderHalfWidthK)
{
    /// <summary>
    /// The correction of a window whose samples were converted by the inverse polynomial, with mean
    /// <paramref name="polynomialMeanK"/> and standard deviation <paramref name="standardDeviationK"/> (K).
    /// Throws <see cref="BcPrepDataException"/> outside the type's range.
    /// </summary>
    public static InversePolynomialCorrection ForWindow(ThermocoupleType type, double polynomialMeanK, double standardDeviationK)
    {
        var s = double.IsFinite(standardDeviationK) ? Math.Abs(standardDeviationK) : 0.0;
        var exact = polynomialMeanK - PolynomialErrorK(type, polynomialMeanK);
        exact = polynomialMeanK - PolynomialErrorK(type, exact);
        var remainder = 0.0;
        if (s > 0.0)
        {
            // Stay where the inverse polynomial is defined (its emf range, a little inside the direct one).
            var range = Its90Thermocouple.InverseRangeV(type);
            var lo = Math.Max(Its90Thermocouple.TemperatureK(type, range.Min, ThermocoupleInverseMethod.ExactNewton) + 1e-6, exact - (2.0 * s));
            var hi = Math.Min(Its90Thermocouple.TemperatureK(type, range.Max, ThermocoupleInverseMethod.ExactNewton) - 1e-6, exact + (2.0 * s));
            remainder = 0.5 * Math.Abs(PolynomialErrorK(type, lo) + PolynomialErrorK(type, hi) - (2.0 * PolynomialErrorK(type, exact)));
        }

        return new InversePolynomialCorrection(exact - polynomialMeanK, remainder);
    }

    /// <summary>h(T) = t_poly(E(T)) − T: the NIST inverse polynomial's error at true temperature T (K).</summary>
    public static double PolynomialErrorK(ThermocoupleType type, double temperatureK) =>
        Its90Thermocouple.TemperatureK(type, Its90Thermocouple.EmfV(type, temperatureK), ThermocoupleInverseMethod.NistPolynomial) - temperatureK;
}
