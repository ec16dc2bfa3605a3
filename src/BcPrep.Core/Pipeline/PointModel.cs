using System.Collections.Immutable;
using System.Globalization;
using BcPrep.Calibration;
using BcPrep.Physics;
using BcPrep.Profiles;
using BcPrep.Rig;
using BcPrep.Uncertainty;

namespace BcPrep.Pipeline;

/// <summary>
/// The measurement model of one operating point: the list of uncertainty inputs (window means, tares, every Type B
/// term, geometry and property-model factors) and the function from those inputs to every boundary-condition
/// quantity and profile point. GUM propagation, Monte Carlo and ensembles all evaluate this same function.
/// </summary>
public sealed partial class PointModel
{
    // Property-model uncertainty, rectangular half-widths below 380 K; see Physics/ModelForm for their sources and
    // for how they grow with temperature.
    public const double ViscosityModelHalfWidth = 0.007;
    public const double CpModelHalfWidth = ModelForm.CpHalfWidth;

    private readonly List<UncertaintyInput> _inputs = [];
    private readonly Dictionary<string, ChannelInputs> _channels = new(StringComparer.Ordinal);
    private readonly PointSettings _settings;
    private int _diameter;
    private int _loss;
    private int _viscosityFactor;
    private int _cpFactor;
    private int _turbulenceFactor = -1;
    private Func<double[], double> _inletPressure = null!;
    private Func<double[], double> _outletPressure = null!;
    private Func<double[], double> _inletTemperature = null!;
    private Func<double[], double> _outletTemperature = null!;
    private Func<double[], double> _massFlow = null!;
    private Func<double[], double> _heaterPower = null!;
    private IReadOnlyList<ChannelSpec> _wallChannels = [];

    private PointModel(PointSettings settings) => _settings = settings;

    public IReadOnlyList<UncertaintyInput> Inputs => _inputs;

    public IReadOnlyList<QuantityDefinition> Outputs { get; private set; } = [];

    public ImmutableArray<double> ProfileRadiiM { get; private set; } = [];

    public PointSettings Settings => _settings;

    /// <summary>True when an outlet channel without a radius gives outlet.temperature (else the outlet rake's mixing cup, else the inlet temperature).</summary>
    public bool HasPlainOutletTemperature { get; private set; }

    public static PointModel Build(
        RigDescription rig,
        IReadOnlyDictionary<string, ChannelWindowStats> window,
        IReadOnlyDictionary<string, ChannelWindowStats> tares,
        IReadOnlyDictionary<string, EndTare>? endTares = null,
        double pointMidS = double.NaN)
    {
        var model = new PointModel(SettingsOf(rig));
        model.AddChannelInputs(rig, window, tares);
        model.AddEndTares(rig, endTares, pointMidS);
        model.AddModelInputs(rig, window);
        model.ResolveRoles(rig);
        model.AddProfileShapeInput();
        model.DefineOutputs();
        return model;
    }

    public static PointSettings SettingsOf(RigDescription rig)
    {
        var spacing = rig.Duct.PlanePositionsM["outlet"] - rig.Duct.PlanePositionsM["inlet"];
        return new PointSettings(rig.Duct.WallRoughnessM, rig.Duct.HeatedLengthM, spacing, rig.Profiles.VelocityModel, rig.Profiles.RadialPoints,
            rig.Profiles.TurbulenceIntensity, rig.Profiles.LengthScaleM);
    }

    /// <summary>Input estimates as a vector (the point of expansion).</summary>
    public double[] Estimates() => _inputs.Select(i => i.Estimate).ToArray();

    // A loss fraction of exactly 0 (the default) is stepped below 0 by the numerical Jacobian; losses cannot be
    // negative, so the model holds them at 0 there.
    public PointMeasurements MeasurementsAt(double[] x) => WithProfileInputs(new(
        _inletPressure(x), _outletPressure(x), _inletTemperature(x), _outletTemperature(x), _massFlow(x), _heaterPower(x),
        [.. _wallChannels.Select(c => _channels[c.Id].ValueAt(x))],
        x[_diameter], Math.Max(0.0, x[_loss]), x[_viscosityFactor], x[_cpFactor]), x);

    /// <summary>The model function: inputs → every output of <see cref="Outputs"/>, in that order.</summary>
    public double[] Evaluate(double[] x)
    {
        // Once per call: the Jacobian and Monte Carlo call this thousands of times per point.
        var measurements = MeasurementsAt(x);
        return Flatten(measurements, PointPhysics.Evaluate(measurements, _settings), includeAll: false);
    }

    public PointQuantities Physics(double[] x) => PointPhysics.Evaluate(MeasurementsAt(x), _settings);

    private void AddChannelInputs(RigDescription rig, IReadOnlyDictionary<string, ChannelWindowStats> window, IReadOnlyDictionary<string, ChannelWindowStats> tares)
    {
        foreach (var channel in rig.Channels)
        {
            if (!window.TryGetValue(channel.Id, out var stats))
            {
                continue;
            }
            var typeA = stats.TypeA;
            var mean = Add(new UncertaintyInput($"{channel.Id} window mean", typeA.Mean, typeA.StandardUncertainty,
                typeA.DegreesOfFreedom, DistributionKind.Normal, EvaluationType.TypeA, "window mean, autocorrelation-corrected (Type A)"));
            var inputs = new ChannelInputs(channel.Id, mean);
            if (channel.Tare is not null && tares.TryGetValue(channel.Id, out var tare))
            {
                inputs.TareIndex = Add(new UncertaintyInput($"{channel.Id} tare mean", tare.TypeA.Mean, tare.TypeA.StandardUncertainty,
                    tare.TypeA.DegreesOfFreedom, DistributionKind.Normal, EvaluationType.TypeA, "no-flow tare reading (Type A)"));
            }
            foreach (var term in channel.Uncertainty)
            {
                var u = TypeBTerms.StandardUncertainty(term, channel, typeA.Mean);
                inputs.AddTerm(Add(new UncertaintyInput($"{channel.Id}: {term.Source}", 0.0, u, term.DegreesOfFreedom,
                    TypeBTerms.Distribution(term), EvaluationType.TypeB, term.Source)), 1.0);
            }
            if (channel.Sensor is ThermocoupleSensor thermocouple)
            {
                AddInverseCorrection(inputs, channel.Id, thermocouple, stats, window);
            }
            if (channel.Sensor is RtdSensor { Certificate: { } rtdCertificate })
            {
                // The certificate's A, B, C are already in the conversion; its uncertainty enters here.
                inputs.AddTerm(Add(new UncertaintyInput($"{channel.Id}: calibration certificate {rtdCertificate.Certificate}", 0.0,
                    rtdCertificate.ExpandedUncertaintyK / rtdCertificate.CoverageFactor, double.PositiveInfinity, DistributionKind.Normal, EvaluationType.TypeB,
                    $"certificate {rtdCertificate.Certificate}: own Callendar-Van Dusen coefficients, expanded uncertainty with k = {rtdCertificate.CoverageFactor.ToString(CultureInfo.InvariantCulture)}")), 1.0);
            }
            if (channel.Sensor is TableSensor table)
            {
                var fit = ChannelConversion.Fit(table);
                var u = fit.ResidualStandardDeviation * Math.Abs(table.UnitToSi.Scale);
                inputs.AddTerm(Add(new UncertaintyInput($"{channel.Id}: calibration fit residual", 0.0, u, fit.DegreesOfFreedom,
                    DistributionKind.Normal, EvaluationType.TypeB, "residual standard deviation of the calibration fit")), 1.0);
            }
            _channels[channel.Id] = inputs;
        }
        CoupleColdJunctions(rig, window);
    }

    /// <summary>
    /// A channel tared at both ends of the day: the zero subtracted is the start tare plus the end tare weighted by
    /// where the point lies between them in time (linear drift, common practice). A drift between the two tares
    /// larger than the declared zero uncertainty (<see cref="ChannelSpec.ZeroUncertaintySi"/>, else the channel's
    /// absolute and span terms) draws a warning in the manifest and the report.
    /// </summary>
    private void AddEndTares(RigDescription rig, IReadOnlyDictionary<string, EndTare>? endTares, double pointMidS)
    {
        if (endTares is null)
        {
            return;
        }
        foreach (var (channelId, end) in endTares)
        {
            if (!_channels.TryGetValue(channelId, out var inputs) || inputs.TareIndex is not { } startIndex || rig.Channel(channelId) is not { } channel)
            {
                continue;
            }
            var startEstimate = _inputs[startIndex].Estimate;
            inputs.EndTareIndex = Add(new UncertaintyInput($"{channelId} end-of-day tare mean", end.Stats.TypeA.Mean, end.Stats.TypeA.StandardUncertainty,
                end.Stats.TypeA.DegreesOfFreedom, DistributionKind.Normal, EvaluationType.TypeA, "no-flow tare reading at the end of the day (Type A)"));
            inputs.EndTareWeight = double.IsFinite(pointMidS) ? end.WeightAt(pointMidS) : 0.0;
            var drift = end.Stats.TypeA.Mean - startEstimate;
            var allowed = channel.ZeroUncertaintySi ?? Math.Sqrt(channel.Uncertainty
                .Where(u => u.Kind is UncertaintyTermKind.Absolute or UncertaintyTermKind.PercentOfSpan)
                .Sum(u => Math.Pow(TypeBTerms.StandardUncertainty(u, channel, 0.0), 2)));
            if (Math.Abs(drift) > allowed)
            {
                _modelWarnings.Add(string.Create(CultureInfo.InvariantCulture,
                    $"channel '{channelId}': its zero drifted by {drift:G4} (SI) between the start and end tares, more than the declared zero uncertainty {allowed:G4}; the zero is interpolated linearly in time, but a drift this size may not be linear"));
            }
        }
    }

    /// <summary>
    /// Thermocouples are inverted exactly by default: the samples go through the NIST inverse polynomial (fast,
    /// vectorised), and the window mean is moved onto the exact inverse of the reference function
    /// (<see cref="InversePolynomialCorrection"/>). The correction is an input of its own, so the budget shows it.
    /// </summary>
    private void AddInverseCorrection(ChannelInputs inputs, string channelId, ThermocoupleSensor thermocouple, ChannelWindowStats stats,
        IReadOnlyDictionary<string, ChannelWindowStats> window)
    {
        if (!double.IsFinite(stats.TypeA.Mean))
        {
            return;
        }
        var type = thermocouple.Type;
        var fix = InversePolynomialCorrection.ForWindow(type, stats.TypeA.Mean, stats.StandardDeviation);
        inputs.AddTerm(Add(new UncertaintyInput($"{channelId}: ITS-90 inverse polynomial correction", fix.CorrectionK,
            TypeB.FromRectangularHalfWidth(fix.RemainderHalfWidthK), double.PositiveInfinity, DistributionKind.Rectangular, EvaluationType.TypeB,
            "exact inverse of the NIST ITS-90 reference function at the window mean, less the inverse polynomial's value")), 1.0);
        if (thermocouple.Certificate is not { } certificate)
        {
            return;
        }
        var referenceK = stats.TypeA.Mean + fix.CorrectionK;
        var junctionK = thermocouple.ColdJunctionK
            ?? (thermocouple.ColdJunctionChannel is { } cj && window.TryGetValue(cj, out var junction) ? junction.TypeA.Mean : Its90Thermocouple.KelvinOffset);
        var correction = certificate.CorrectionK(type, referenceK, junctionK);
        inputs.AddTerm(Add(new UncertaintyInput($"{channelId}: certificate correction ({certificate.Certificate})", correction,
            certificate.StandardUncertaintyK(type, referenceK + correction), double.PositiveInfinity, DistributionKind.Normal, EvaluationType.TypeB,
            $"certificate {certificate.Certificate}: {certificate.Kind.ToString().ToLowerInvariant()} correction, expanded uncertainty with k = {certificate.CoverageFactor.ToString(CultureInfo.InvariantCulture)}")), 1.0);
    }

    /// <summary>A cold-junction sensor's error enters each thermocouple scaled by S(T_cj)/S(T_hot) (emf addition).</summary>
    private void CoupleColdJunctions(RigDescription rig, IReadOnlyDictionary<string, ChannelWindowStats> window)
    {
        foreach (var channel in rig.Channels)
        {
            if (channel.Sensor is not ThermocoupleSensor { ColdJunctionChannel: { } cj } tc || !_channels.TryGetValue(channel.Id, out var hot) || !_channels.TryGetValue(cj, out var cold))
            {
                continue;
            }
            var sensitivity = ColdJunction.SensitivityToReferenceJunction(tc.Type, window[channel.Id].Mean, window[cj].Mean);
            foreach (var (index, coefficient) in cold.Terms)
            {
                hot.AddTerm(index, coefficient * sensitivity);
            }
        }
    }

    private void AddModelInputs(RigDescription rig, IReadOnlyDictionary<string, ChannelWindowStats> window)
    {
        _diameter = Add(new UncertaintyInput("duct inner diameter", rig.Duct.InnerDiameterM, rig.Duct.InnerDiameterStdM, double.PositiveInfinity,
            DistributionKind.Normal, EvaluationType.TypeB, "rig file: duct.inner_diameter_uncertainty"));
        _loss = Add(LossFractionInput(rig.Duct.HeaterLossFraction, rig.Duct.HeaterLossFractionStd));

        // The property models are judged where the air is: the hottest and the mean of the bulk-temperature means.
        var bulk = rig.WithRole(ChannelRole.BulkTemperature).Select(c => window.TryGetValue(c.Id, out var w) ? w.TypeA.Mean : double.NaN)
            .Where(double.IsFinite).DefaultIfEmpty(293.15).ToList();
        var hottestK = bulk.Max();
        var viscosityHalfWidth = ModelForm.ViscosityHalfWidth(hottestK);
        _viscosityFactor = Add(new UncertaintyInput("viscosity model (Sutherland)", 1.0, TypeB.FromRectangularHalfWidth(viscosityHalfWidth), double.PositiveInfinity,
            DistributionKind.Rectangular, EvaluationType.TypeB, string.Create(CultureInfo.InvariantCulture,
                $"Sutherland's law against Lemmon & Jacobsen (2004): ±{viscosityHalfWidth * 100:0.##} % at {hottestK:F0} K (±0.7 % holds below 380 K)")));
        var meanK = bulk.Average();
        _cpFactor = Add(new UncertaintyInput("cp model (ideal gas, corrected to 1-atm tables)", ModelForm.CpCorrection(meanK), TypeB.FromRectangularHalfWidth(CpModelHalfWidth), double.PositiveInfinity,
            DistributionKind.Rectangular, EvaluationType.TypeB, string.Create(CultureInfo.InvariantCulture,
                $"ideal-gas cp is biased low: factor {ModelForm.CpCorrection(meanK):F4} at {meanK:F0} K from 1-atm tables (Incropera A.4, Çengel A-15), ±0.15 %")));
        if (rig.Profiles.TurbulenceIntensity is null)
        {
            _turbulenceFactor = Add(new UncertaintyInput("turbulence intensity model (0.16 Re^-1/8)", 1.0, TypeB.FromRectangularHalfWidth(ModelForm.TurbulenceIntensityHalfWidth),
                double.PositiveInfinity, DistributionKind.Rectangular, EvaluationType.TypeB,
                "core-flow estimate against area-averaged pipe-flow fits (Russo & Basse 2016): about a factor of 2 apart, ±50 %"));
        }
    }

    /// <summary>
    /// A loss fraction lies in [0, 1): a normal distribution would let Monte Carlo and ensemble draws go negative
    /// (5 % ± 2 % does so in 0.6 % of draws), so it is rectangular with the declared u whenever that fits (JCGM 101
    /// 6.4.2.1); GUM sees only u, so its result does not change.
    /// </summary>
    public static UncertaintyInput LossFractionInput(double fraction, double standardUncertainty)
    {
        var halfWidth = Math.Sqrt(3.0) * standardUncertainty;
        var fits = fraction - halfWidth >= 0.0 && fraction + halfWidth < 1.0;
        return new UncertaintyInput("heater loss fraction", fraction, standardUncertainty, double.PositiveInfinity,
            fits ? DistributionKind.Rectangular : DistributionKind.Normal, EvaluationType.TypeB,
            "rig file: duct.heater_loss_fraction_uncertainty" + (fits ? " (rectangular: a fraction is bounded)" : ""));
    }

    private void ResolveRoles(RigDescription rig)
    {
        var problems = new List<Problem>();
        _inletPressure = Required(rig, ChannelRole.StaticPressure, "inlet", problems, absolute: true);
        _outletPressure = Required(rig, ChannelRole.StaticPressure, "outlet", problems, absolute: true);
        _wallChannels = rig.WithRole(ChannelRole.WallTemperature).Where(c => _channels.ContainsKey(c.Id)).OrderBy(c => c.AxialPositionM).ToList();
        ResolveProfileInputs(rig);
        _inletTemperature = Optional(rig, ChannelRole.BulkTemperature, "inlet") ?? RakeMeanTemperature()
            ?? Required(rig, ChannelRole.BulkTemperature, "inlet", problems, absolute: false);
        var plainOutlet = Optional(rig, ChannelRole.BulkTemperature, "outlet");
        HasPlainOutletTemperature = plainOutlet is not null;
        _outletTemperature = plainOutlet ?? OutletMixingCupTemperature() ?? _inletTemperature;
        _massFlow = Optional(rig, ChannelRole.MassFlow, null) ?? (problems.Count == 0 ? FlowMeterMassFlow(rig) : null)
            ?? Required(rig, ChannelRole.MassFlow, null, problems, absolute: false);
        _heaterPower = HeaterPower(rig);
        if (problems.Count > 0)
        {
            throw new BcPrepFailure(FailureKind.Configuration, problems);
        }
    }

    private Func<double[], double> Required(RigDescription rig, ChannelRole role, string? plane, List<Problem> problems, bool absolute)
    {
        var found = Optional(rig, role, plane, absolute);
        if (found is null)
        {
            var what = role.ToString();
            problems.Add(new Problem(new SourceLocation(rig.SourceFile, Key: "channel"),
                $"no channel measures {what}{(plane is null ? "" : $" at the {plane} plane")}: the boundary conditions need one{(role == ChannelRole.MassFlow ? " (or a [flow_meter] table)" : "")}"));
            return _ => double.NaN;
        }
        return found;
    }

    /// <summary>The average of every channel with the role (and plane); gauge pressures get their reference added.</summary>
    private Func<double[], double>? Optional(RigDescription rig, ChannelRole role, string? plane, bool absolute = false)
    {
        // Rake sensors (with a radius) sample a profile, not the plane's bulk value.
        var matches = rig.WithRole(role).Where(c => (plane is null || c.Plane == plane) && c.RadiusM is null && _channels.ContainsKey(c.Id)).ToList();
        if (matches.Count == 0)
        {
            return null;
        }
        var readers = matches.Select(c =>
        {
            var own = _channels[c.Id];
            if (absolute && c.ReferenceChannel is { } reference && _channels.TryGetValue(reference, out var refInputs))
            {
                return (Func<double[], double>)(x => own.ValueAt(x) + refInputs.ValueAt(x));
            }
            return own.ValueAt;
        }).ToList();
        return x =>
        {
            var sum = 0.0;
            foreach (var read in readers)
            {
                sum += read(x);
            }
            return sum / readers.Count;
        };
    }

    private Func<double[], double> HeaterPower(RigDescription rig)
    {
        var power = Optional(rig, ChannelRole.HeaterPower, null);
        if (power is not null)
        {
            return power;
        }
        var volts = Optional(rig, ChannelRole.HeaterVoltage, null);
        var amps = Optional(rig, ChannelRole.HeaterCurrent, null);
        return volts is not null && amps is not null ? x => BcPrep.Physics.HeatTransfer.HeaterPower(volts(x), amps(x)) : _ => 0.0;
    }

    private void DefineOutputs()
    {
        var x = Estimates();
        var measurements = MeasurementsAt(x);
        var nominal = PointPhysics.Evaluate(measurements, _settings);
        ProfileRadiiM = nominal.Velocity.Profile.RadiusM;
        _runs = Runs(nominal.Velocity.Profile.RadiusM.Length, nominal.TemperatureProfile is null ? 0 : nominal.Velocity.Profile.RadiusM.Length);
        var all = _runs.SelectMany(r => r.Definitions).ToList();
        var values = Flatten(measurements, nominal, includeAll: true);
        _included = all.Select((d, i) => double.IsFinite(values[i])).ToArray();
        Outputs = all.Where((d, i) => _included[i]).ToList();
    }

    private bool[] _included = [];
    private IReadOnlyList<OutputRun> _runs = [];

    /// <summary>A run of outputs read together from the model's result: their definitions, and how their values are appended.</summary>
    private sealed record OutputRun(IReadOnlyList<QuantityDefinition> Definitions, Action<PointMeasurements, PointQuantities, List<double>> Append);

    /// <summary>
    /// The point's output table: the scalars of <see cref="PointOutputs"/>, then this point's wall thermocouples, velocity
    /// profile, wall grid and rake profile. Definitions and values both come from it, so they cannot fall out of step.
    /// </summary>
    private List<OutputRun> Runs(int profilePoints, int temperatureProfilePoints)
    {
        var runs = PointOutputs.Scalars.Select(s => new OutputRun([s.Definition], (m, q, into) => into.Add(s.Value(m, q)))).ToList();
        runs.Add(new([.. _wallChannels.Select(c => new QuantityDefinition(ProfileOutputs.WallPoint(c.Id), "K",
                string.Create(CultureInfo.InvariantCulture, $"wall temperature at z = {c.AxialPositionM:G6} m")) { Kind = QuantityKind.WallPoint })],
            (m, _, into) => into.AddRange(m.WallTemperaturesK)));
        runs.Add(new([.. Enumerable.Range(0, profilePoints).Select(i => new QuantityDefinition(ProfileOutputs.Velocity(i), "m/s",
                "axial velocity at profile point " + i) { Kind = QuantityKind.ProfilePoint })],
            (_, q, into) => into.AddRange(q.Velocity.Profile.Values)));
        runs.Add(new([.. WallGridM.Select((z, i) => new QuantityDefinition(ProfileOutputs.WallGrid(i), "K",
                string.Create(CultureInfo.InvariantCulture, $"wall temperature interpolated at z = {z:G6} m")) { Kind = QuantityKind.ProfilePoint })],
            (m, _, into) => into.AddRange(WallGridTemperatures(m))));
        runs.Add(new([.. Enumerable.Range(0, temperatureProfilePoints).Select(i => new QuantityDefinition(ProfileOutputs.Temperature(i), "K",
                "inlet temperature from the rake at profile point " + i) { Kind = QuantityKind.ProfilePoint })],
            (_, q, into) => into.AddRange(q.TemperatureProfile?.Profile.Values ?? [])));
        foreach (var plane in RakePlanes)
        {
            // The outlet's mixing-cup temperature is an entry of the scalar table; other planes' follow here.
            if (plane != "outlet")
            {
                var scalar = PointOutputs.MixingCupTemperature(plane);
                runs.Add(new([scalar.Definition], (m, q, into) => into.Add(scalar.Value(m, q))));
            }
            runs.Add(new([.. Enumerable.Range(0, profilePoints).Select(i => new QuantityDefinition(ProfileOutputs.PlaneTemperature(plane, i), "K",
                    $"{plane} temperature from the rake at profile point {i}") { Kind = QuantityKind.ProfilePoint })],
                (_, q, into) => into.AddRange(q.Rakes.First(r => r.Plane == plane).Temperature.Profile.Values)));
        }
        return runs;
    }

    private double[] Flatten(PointMeasurements m, PointQuantities q, bool includeAll)
    {
        var values = new List<double>(_included.Length);
        foreach (var run in _runs)
        {
            run.Append(m, q, values);
        }
        if (includeAll)
        {
            return values.ToArray();
        }
        var result = new double[Outputs.Count];
        var j = 0;
        for (var i = 0; i < values.Count; i++)
        {
            if (_included[i])
            {
                result[j++] = values[i];
            }
        }
        return result;
    }

    private int Add(UncertaintyInput input)
    {
        _inputs.Add(input);
        return _inputs.Count - 1;
    }
}
