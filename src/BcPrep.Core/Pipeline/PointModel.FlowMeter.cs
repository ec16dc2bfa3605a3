using BcPrep.Physics;
using BcPrep.Rig;
using BcPrep.Uncertainty;

namespace BcPrep.Pipeline;

/// <summary>The nominal state of the differential-pressure flow meter of a point, for the manifest.</summary>
public sealed record FlowMeterNominal(FlowMeterKind Kind, OrificeTapping? Tapping, DifferentialPressureFlowResult Result,
    double UpstreamPressurePa, double UpstreamTemperatureK, double UpstreamDensityKgPerM3)
{
    /// <summary>Where C comes from: the standard's equation or value (with the Venturi's convergent form), or the meter's flow calibration.</summary>
    public string DischargeCoefficientSource { get; init; } = "";
}

/// <summary>Mass flow from an ISO 5167 orifice plate or Venturi tube when the rig has no mass-flow channel.</summary>
public sealed partial class PointModel
{
    // ISO 5167-1 states the uncertainties of C and ε as 95 % expanded uncertainties with k = 2 (from memory).
    private const double IsoCoverageFactor = 2.0;

    /// <summary>The flow meter at the input estimates; null when the mass flow comes from a mass_flow channel.</summary>
    public FlowMeterNominal? FlowMeter { get; private set; }

    /// <summary>Warnings raised while building the model (e.g. Re_D outside the meter standard's range).</summary>
    public IReadOnlyList<string> ModelWarnings => _modelWarnings;

    private readonly List<string> _modelWarnings = [];

    /// <summary>
    /// q_m(x) = q_m,ISO(D, d, Δp, p1, ρ1, μ1) · F_C · F_ε, where F_C and F_ε are Type B factors of estimate 1 whose
    /// standard uncertainties are the standard's 95 % statements for C and ε divided by k = 2, evaluated once at
    /// the input estimates. ρ1 is dry air at (p1, T1), or the inlet moist-air density scaled to (p1, T1).
    /// </summary>
    private Func<double[], double>? FlowMeterMassFlow(RigDescription rig)
    {
        if (rig.FlowMeter is not { } spec)
        {
            return null;
        }
        var pipe = Add(new UncertaintyInput("flow meter pipe diameter", spec.PipeDiameterM, spec.PipeDiameterStdM, double.PositiveInfinity,
            DistributionKind.Normal, EvaluationType.TypeB, "rig file: flow_meter.pipe_diameter_uncertainty"));
        var throat = Add(new UncertaintyInput(spec.Kind == FlowMeterKind.Orifice ? "orifice bore diameter" : "Venturi throat diameter",
            spec.ThroatDiameterM, spec.ThroatDiameterStdM, double.PositiveInfinity, DistributionKind.Normal, EvaluationType.TypeB,
            spec.Kind == FlowMeterKind.Orifice ? "rig file: flow_meter.bore_diameter_uncertainty" : "rig file: flow_meter.throat_diameter_uncertainty"));
        var dp = spec.DifferentialPressureChannel is { } dpId ? ChannelReader(rig, dpId, absolute: false) : Optional(rig, ChannelRole.DifferentialPressure, null);
        var p1 = ChannelReader(rig, spec.UpstreamPressureChannel, absolute: true);
        var t1 = spec.UpstreamTemperatureChannel is { } tId ? ChannelReader(rig, tId, absolute: false) : _inletTemperature;
        if (dp is null || p1 is null || t1 is null)
        {
            throw new BcPrepFailure(FailureKind.Configuration, spec.Location,
                "the flow meter's differential-pressure, upstream-pressure or upstream-temperature channel has no data in this window");
        }
        var humidity = _humidity;
        DifferentialPressureFlowInput Input(double[] x)
        {
            var p = p1(x);
            var t = t1(x);
            var rho = humidity is null
                ? DryAir.Density(p, t)
                : PointPhysics.Density(_inletPressure(x), _inletTemperature(x), humidity(x)) * (p / _inletPressure(x)) * (_inletTemperature(x) / t);
            return new DifferentialPressureFlowInput(x[pipe], x[throat], dp(x), p, rho, DryAir.Viscosity(t) * x[_viscosityFactor], spec.IsentropicExponent);
        }
        // The standard's geometry range is judged at the declared geometry only (see VenturiTube.MassFlow).
        DifferentialPressureFlowResult Meter(double[] x, bool checkGeometry = false) => spec.Calibration is { } calibration
            ? CalibratedMeter.MassFlow(Input(x), calibration, venturi: spec.Kind == FlowMeterKind.Venturi)
            : spec.Kind == FlowMeterKind.Orifice
                ? OrificeMeter.MassFlow(Input(x), spec.Tapping, checkGeometry)
                : VenturiTube.MassFlow(Input(x), spec.Convergent, checkGeometry);

        var estimates = Estimates();
        var nominal = Meter(estimates, checkGeometry: true);
        var nominalInput = Input(estimates);
        FlowMeter = new FlowMeterNominal(spec.Kind, spec.Kind == FlowMeterKind.Orifice ? spec.Tapping : null, nominal,
            nominalInput.UpstreamPressurePa, t1(estimates), nominalInput.UpstreamDensityKgPerM3)
        {
            DischargeCoefficientSource = spec.Calibration is { } c
                ? $"flow calibration {c.Certificate}: {c.Describe()}"
                : spec.Kind == FlowMeterKind.Orifice
                    ? "ISO 5167-2 Reader-Harris/Gallagher equation"
                    : "ISO 5167-4, " + VenturiForm.Of(spec.Convergent).Name,
        };
        _modelWarnings.AddRange(nominal.Warnings);
        var standard = spec.Kind == FlowMeterKind.Orifice ? "ISO 5167-2 §5.3.3" : "ISO 5167-4";
        var cFactor = spec.Calibration is { } cal
            ? Add(new UncertaintyInput("discharge coefficient C (flow calibration " + cal.Certificate + ")", 1.0,
                TypeB.FromCertificate(cal.ExpandedUncertaintyPercent / 100.0, cal.CoverageFactor), double.PositiveInfinity,
                DistributionKind.Normal, EvaluationType.TypeB, string.Create(System.Globalization.CultureInfo.InvariantCulture,
                    $"flow calibration {cal.Certificate}: relative expanded uncertainty of C {cal.ExpandedUncertaintyPercent:R} %, k = {cal.CoverageFactor:R}")))
            : Add(new UncertaintyInput("discharge coefficient C (" + standard + ")", 1.0,
                TypeB.FromCertificate(nominal.DischargeCoefficientExpandedUncertaintyPercent / 100.0, IsoCoverageFactor), double.PositiveInfinity,
                DistributionKind.Normal, EvaluationType.TypeB, standard + ": 95 % relative uncertainty of C, k = 2"));
        var epsilonFactor = Add(new UncertaintyInput("expansibility factor (" + standard + ")", 1.0,
            TypeB.FromCertificate(nominal.ExpansibilityExpandedUncertaintyPercent / 100.0, IsoCoverageFactor), double.PositiveInfinity,
            DistributionKind.Normal, EvaluationType.TypeB, standard + ": 95 % relative uncertainty of the expansibility factor, k = 2"));
        return x => Meter(x).MassFlowKgPerS * x[cFactor] * x[epsilonFactor];
    }

    /// <summary>One named channel's value; a gauge pressure gets its reference channel added when absolute.</summary>
    private Func<double[], double>? ChannelReader(RigDescription rig, string id, bool absolute)
    {
        if (!_channels.TryGetValue(id, out var own))
        {
            return null;
        }
        if (absolute && rig.Channel(id)?.ReferenceChannel is { } reference && _channels.TryGetValue(reference, out var refInputs))
        {
            return x => own.ValueAt(x) + refInputs.ValueAt(x);
        }
        return own.ValueAt;
    }
}
