using BcPrep.Physics;

namespace BcPrep.Rig;

/// <summary>Which ISO 5167 differential-pressure device measures the flow.</summary>
public enum FlowMeterKind
{
    /// <summary>Orifice plate, ISO 5167-2 (Reader-Harris/Gallagher C, iterated on Re_D).</summary>
    Orifice,

    /// <summary>Classical Venturi tube with a machined convergent, ISO 5167-4.</summary>
    Venturi,
}

/// <summary>
/// A differential-pressure flow meter from the rig file's <c>[flow_meter]</c> table. Diameters and their standard
/// uncertainties in m. Channels are named by id: the differential pressure (null: every differential_pressure
/// channel, averaged), the absolute (or gauge-with-reference) upstream tapping pressure, and the upstream
/// temperature (null: the inlet-plane bulk temperature).
/// </summary>
public sealed record FlowMeterSpec(
    FlowMeterKind Kind,
    double PipeDiameterM,
    double PipeDiameterStdM,
    double ThroatDiameterM,
    double ThroatDiameterStdM,
    OrificeTapping Tapping,
    string? DifferentialPressureChannel,
    string UpstreamPressureChannel,
    string? UpstreamTemperatureChannel,
    double IsentropicExponent,
    SourceLocation Location);
