using BcPrep.Physics;

namespace BcPrep.Rig;

/// <summary>Which ISO 5167 differential-pressure device measures the flow.</summary>
public enum FlowMeterKind
{
    /// <summary>Orifice plate, ISO 5167-2 (Reader-Harris/Gallagher C, iterated on Re_D).</summary>
    Orifice,

    /// <summary>Classical Venturi tube, ISO 5167-4 (machined, as-cast or rough-welded convergent).</summary>
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
    SourceLocation Location)
{
    /// <summary>The convergent form of a Venturi tube (ISO 5167-4); machined unless the rig file says otherwise.</summary>
    public VenturiConvergent Convergent { get; init; } = VenturiConvergent.Machined;

    /// <summary>The meter's own flow calibration of C (a constant or a table against Re_D); null: the standard's C.</summary>
    public DischargeCalibration? Calibration { get; init; }
}
