using BcPrep.Calibration;
using BcPrep.Uncertainty;

namespace BcPrep.Rig;

/// <summary>
/// How a logged number becomes an engineering value. Coefficients are in the user's units as written on the
/// certificate (<see cref="RawUnit"/> in, <see cref="Unit"/> out); <see cref="RawToSi"/> and <see cref="UnitToSi"/>
/// are the affine maps of those units to SI, worked out once when the rig file is read.
/// </summary>
public abstract record SensorSpec(string RawUnit, string Unit, Affine RawToSi, Affine UnitToSi);

/// <summary>y = gain·x + offset, in the user's units.</summary>
public sealed record LinearSensor(string RawUnit, string Unit, Affine RawToSi, Affine UnitToSi, double Gain, double Offset)
    : SensorSpec(RawUnit, Unit, RawToSi, UnitToSi);

/// <summary>y = Σ cᵢ xⁱ (ascending powers), in the user's units.</summary>
public sealed record PolynomialSensor(string RawUnit, string Unit, Affine RawToSi, Affine UnitToSi, IReadOnlyList<double> Coefficients)
    : SensorSpec(RawUnit, Unit, RawToSi, UnitToSi);

/// <summary>Calibration points fitted by least squares of the given degree.</summary>
public sealed record TableSensor(string RawUnit, string Unit, Affine RawToSi, Affine UnitToSi, IReadOnlyList<double> Raw, IReadOnlyList<double> Values, int Degree)
    : SensorSpec(RawUnit, Unit, RawToSi, UnitToSi);

/// <summary>Thermocouple emf (raw) to temperature by the NIST ITS-90 functions, with cold-junction compensation.</summary>
public sealed record ThermocoupleSensor(string RawUnit, Affine RawToSi, ThermocoupleType Type, string? ColdJunctionChannel, double? ColdJunctionK, string? ToleranceClass)
    : SensorSpec(RawUnit, "K", RawToSi, Affine.Identity)
{
    /// <summary>The sensor's calibration-certificate correction (<c>correction</c>), or null.</summary>
    public ThermocoupleCertificate? Certificate { get; init; }
}

/// <summary>Platinum RTD resistance (raw) to temperature by IEC 60751 Callendar–Van Dusen.</summary>
public sealed record RtdSensor(string RawUnit, Affine RawToSi, double R0Ohm, string? ToleranceClass)
    : SensorSpec(RawUnit, "K", RawToSi, Affine.Identity)
{
    /// <summary>The sensor's own A, B, C from its certificate (<c>coefficients</c>), or null for IEC 60751's.</summary>
    public RtdCertificate? Certificate { get; init; }

    /// <summary>R0 with the certificate's coefficients, or with IEC 60751's.</summary>
    public RtdNominal Nominal => Certificate is { } c
        ? new RtdNominal(R0Ohm, c.A, c.B, c.C)
        : new RtdNominal(R0Ohm);
}

/// <summary>The logged number already is the engineering value in <see cref="SensorSpec.Unit"/>.</summary>
public sealed record DirectSensor(string Unit, Affine UnitToSi)
    : SensorSpec(Unit, Unit, UnitToSi, UnitToSi);

/// <summary>An affine unit map y = Scale·x + Shift (every unit conversion is one; only temperatures shift).</summary>
public readonly record struct Affine(double Scale, double Shift)
{
    public static Affine Identity => new(1.0, 0.0);

    public double Apply(double x) => Scale * x + Shift;
}

/// <summary>
/// A Type B uncertainty term of a channel, as written in the rig file. <see cref="ValueSi"/> is in the
/// channel's SI unit (a temperature term is a difference in K) except for <see cref="UncertaintyTermKind.PercentOfReading"/>,
/// where it is a fraction.
/// </summary>
public sealed record UncertaintyTerm(
    UncertaintyTermKind Kind,
    double ValueSi,
    double CoverageFactor,
    DistributionKind Distribution,
    double DegreesOfFreedom,
    string Source,
    string? ToleranceClass);

public enum UncertaintyTermKind
{
    /// <summary>Expanded uncertainty U with coverage factor k from a calibration certificate: u = U/k.</summary>
    Certificate,
    /// <summary>Spec-sheet limit as a fraction of reading (rectangular unless stated).</summary>
    PercentOfReading,
    /// <summary>Spec-sheet limit as a fraction of span, stored as an absolute half-width.</summary>
    PercentOfSpan,
    /// <summary>An absolute limit (half-width) or standard uncertainty (normal).</summary>
    Absolute,
    /// <summary>Display or digitiser resolution δ: u = δ/√12.</summary>
    Resolution,
    /// <summary>Thermocouple (IEC 60584-1) or RTD (IEC 60751) tolerance class, evaluated at the reading.</summary>
    ToleranceClass,
}
