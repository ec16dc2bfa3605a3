namespace BcPrep.Calibration;

/// <summary>How a thermocouple's calibration certificate states its correction.</summary>
public enum ThermocoupleCorrectionKind
{
    /// <summary>A constant emf added to the measured emf (V).</summary>
    Emf,

    /// <summary>A constant added to the temperature (K).</summary>
    Temperature,

    /// <summary>A deviation function ΔE(t) = E_sensor(t) − E_ref(t) = Σ aᵢ tⁱ (t in °C, ΔE in V).</summary>
    Deviation,
}

/// <summary>
/// A thermocouple's certificate correction with its expanded uncertainty (V for emf kinds, K for a temperature
/// offset) and coverage factor. The deviation-function practice follows NIST SP 250-35 (reference sheet §11, [FM]):
/// the sensor's emf is E_ref(t) + ΔE(t), so with the reference junction at t_cj, compensated by E_ref(t_cj), the
/// loop reads E = E_ref(t) + ΔE(t) − ΔE(t_cj), and t solves that equation.
/// </summary>
public sealed record ThermocoupleCertificate(
    ThermocoupleCorrectionKind Kind,
    double ValueSi,
    IReadOnlyList<double> DeviationVPerCelsiusPower,
    double ExpandedUncertaintySi,
    double CoverageFactor,
    string Certificate)
{
    private const int MaxNewtonSteps = 50;

    /// <summary>
    /// The correction (K) to add to <paramref name="referenceFunctionK"/>, the temperature that the exact inverse of
    /// the reference function gives for the loop's compensated emf; <paramref name="referenceJunctionK"/> is the
    /// reference junction (the deviation function's ΔE(t_cj) leaves the loop there).
    /// </summary>
    public double CorrectionK(ThermocoupleType type, double referenceFunctionK, double referenceJunctionK)
    {
        switch (Kind)
        {
            case ThermocoupleCorrectionKind.Temperature:
                return ValueSi;
            case ThermocoupleCorrectionKind.Emf:
                return Its90Thermocouple.TemperatureK(type, Its90Thermocouple.EmfV(type, referenceFunctionK) + ValueSi, ThermocoupleInverseMethod.ExactNewton) - referenceFunctionK;
            default:
            {
                // Solve E_ref(t) + ΔE(t) − ΔE(t_cj) = E_ref(T_ref) by Newton from T_ref (ΔE is a small correction).
                var target = Its90Thermocouple.EmfV(type, referenceFunctionK) + Deviation(referenceJunctionK - Its90Thermocouple.KelvinOffset);
                var t = referenceFunctionK;
                for (var i = 0; i < MaxNewtonSteps; i++)
                {
                    var celsius = t - Its90Thermocouple.KelvinOffset;
                    var residual = Its90Thermocouple.EmfV(type, t) + Deviation(celsius) - target;
                    var step = residual / (Its90Thermocouple.SeebeckVPerK(type, t) + DeviationSlope(celsius));
                    t -= step;
                    if (Math.Abs(step) < 1e-10)
                    {
                        break;
                    }
                }

                return t - referenceFunctionK;
            }
        }
    }

    /// <summary>The certificate's standard uncertainty U/k as a temperature (K) at <paramref name="temperatureK"/>.</summary>
    public double StandardUncertaintyK(ThermocoupleType type, double temperatureK) => Kind == ThermocoupleCorrectionKind.Temperature
        ? ExpandedUncertaintySi / CoverageFactor
        : ExpandedUncertaintySi / CoverageFactor / Its90Thermocouple.SeebeckVPerK(type, temperatureK);

    private double Deviation(double celsius)
    {
        var sum = 0.0;
        for (var i = DeviationVPerCelsiusPower.Count - 1; i >= 0; i--)
        {
            sum = (sum * celsius) + DeviationVPerCelsiusPower[i];
        }

        return sum;
    }

    private double DeviationSlope(double celsius)
    {
        var sum = 0.0;
        for (var i = DeviationVPerCelsiusPower.Count - 1; i >= 1; i--)
        {
            sum = (sum * celsius) + (i * DeviationVPerCelsiusPower[i]);
        }

        return sum;
    }
}

/// <summary>A calibrated RTD's own Callendar–Van Dusen coefficients with the certificate's expanded uncertainty (K) and k.</summary>
public sealed record RtdCertificate(double A, double B, double C, double ExpandedUncertaintyK, double CoverageFactor, string Certificate);
