using System.Globalization;
using BcPrep.Calibration;
using BcPrep.Profiles;
using BcPrep.Uncertainty;

namespace BcPrep.Rig;

/// <summary>
/// Reads a rig file (TOML) into a <see cref="RigDescription"/>. Every problem found is collected; if any, a
/// <see cref="BcPrepFailure"/> of kind <see cref="FailureKind.Configuration"/> lists them all with line and key.
/// </summary>
public static class RigLoader
{
    /// <summary>The upper bound on radial profile points (a resource limit, not physics).</summary>
    public const int MaxRadialPoints = 10_000;

    private static readonly string[] Roles =
    [
        "barometric_pressure", "static_pressure", "differential_pressure", "bulk_temperature", "wall_temperature",
        "cold_junction_temperature", "mass_flow", "heater_voltage", "heater_current", "heater_power",
        "relative_humidity", "other",
    ];

    private static readonly string[] SensorKinds = ["linear", "polynomial", "table", "thermocouple", "rtd", "direct"];

    public static RigDescription Load(string text, string fileName)
    {
        var (root, problems) = TomlTree.Parse(text, fileName);
        var all = new List<Problem>(problems);
        if (all.Count > 0)
        {
            throw new BcPrepFailure(FailureKind.Configuration, all);
        }
        var rig = Read(new TableReader(root, all), fileName, all);
        if (all.Count > 0 || rig is null)
        {
            throw new BcPrepFailure(FailureKind.Configuration, all.OrderBy(p => p.Location.Line ?? 0).ToList());
        }
        return rig;
    }

    private static RigDescription? Read(TableReader top, string fileName, List<Problem> problems)
    {
        var rigTable = top.Table("rig", required: true);
        var name = rigTable?.String("name", required: true) ?? "";
        var fluid = rigTable?.Choice("fluid", ["dry_air"], "dry_air");
        var coverage = rigTable?.Number("coverage_probability", min: 0.5, max: 0.9999) ?? 0.95;
        rigTable?.RejectUnknownKeys();

        var duct = ReadDuct(top.Table("duct", required: true));
        var log = ReadLog(top.Table("log", required: true));
        var declaredIds = new HashSet<string>(StringComparer.Ordinal);
        var channels = top.Tables("channel").Select(t => ReadChannel(t, declaredIds)).Where(c => c is not null).Select(c => c!).ToList();
        if (channels.Count == 0)
        {
            top.Report("channel", "no [[channel]] is declared");
        }
        var points = top.Tables("point").Select(ReadPoint).Where(p => p is not null).Select(p => p!).ToList();
        var steady = ReadSteady(top.Table("steady"), channels, declaredIds);
        var profileTable = top.Table("inlet_profile");
        var face = BoundaryKeys.ReadFace(profileTable?.Table("face"));
        var profiles = ReadProfiles(profileTable);
        var flowMeter = BoundaryKeys.ReadFlowMeter(top.Table("flow_meter"));
        var wall = BoundaryKeys.ReadWall(top.Table("wall"));
        var conditioning = ConditioningReader.Read(top.Table("conditioning"));
        top.RejectUnknownKeys();

        CheckReferences(channels, duct, points, problems);
        BoundaryKeys.Check(channels, duct, flowMeter, problems);
        return duct is null || log is null
            ? null
            : new RigDescription(name, fileName, duct, log, channels, points, steady, profiles, coverage) { FlowMeter = flowMeter, Wall = wall, InletFace = face, Conditioning = conditioning };
    }

    private static DuctGeometry? ReadDuct(TableReader? t)
    {
        if (t is null)
        {
            return null;
        }
        var diameter = t.Quantity("inner_diameter", Dimension.Length, required: true, minSi: 1e-3, maxSi: 10);
        var diameterStd = t.Quantity("inner_diameter_uncertainty", Dimension.Length, minSi: 0) ?? 0.0;
        var roughness = t.Quantity("wall_roughness", Dimension.Length, minSi: 0) ?? 0.0;
        var heated = t.Quantity("heated_length", Dimension.Length, minSi: 0, maxSi: 1000) ?? 0.0;
        var loss = t.Quantity("heater_loss_fraction", Dimension.Dimensionless, minSi: 0, maxSi: 0.99) ?? 0.0;
        var lossStd = t.Quantity("heater_loss_fraction_uncertainty", Dimension.Dimensionless, minSi: 0, maxSi: 1) ?? 0.0;
        var planes = new Dictionary<string, double>(StringComparer.Ordinal);
        var planeTable = t.Table("planes", required: true);
        if (planeTable is not null)
        {
            foreach (var key in planeTable.Node.Keys.ToList())
            {
                if (planeTable.Quantity(key, Dimension.Length) is { } z)
                {
                    planes[key] = z;
                }
            }
            foreach (var needed in new[] { "inlet", "outlet" })
            {
                if (!planes.ContainsKey(needed) && !planeTable.Node.TryGet(needed, out _))
                {
                    planeTable.Report(needed, $"plane '{needed}' must be given (its axial position, e.g. \"0.2 m\")");
                }
            }
            if (planes.TryGetValue("inlet", out var zIn) && planes.TryGetValue("outlet", out var zOut) && zOut <= zIn)
            {
                planeTable.Report("outlet", "the outlet plane must lie downstream of the inlet plane (larger axial position)");
            }
        }
        if (diameter is { } dm && diameterStd >= dm / 2)
        {
            // At k = 2 the interval d ± 2u would reach a zero or negative bore: no measurement model holds there.
            t.Report("inner_diameter_uncertainty", "the standard uncertainty of the diameter is not below half the diameter, so d ± 2u reaches zero: is it in the wrong unit?");
        }
        if (diameter is { } d && roughness >= d / 2)
        {
            t.Report("wall_roughness", "wall roughness is not smaller than the radius: impossible geometry");
        }
        t.RejectUnknownKeys();
        return diameter is null ? null : new DuctGeometry(diameter.Value, diameterStd, roughness, heated, loss, lossStd, planes);
    }

    private static LogFormat? ReadLog(TableReader? t)
    {
        if (t is null)
        {
            return null;
        }
        var timeColumn = t.String("time_column", required: true) ?? "time";
        var format = t.Choice("time_format", ["seconds", "iso8601"], "seconds") == "iso8601" ? TimeFormat.Iso8601 : TimeFormat.Seconds;
        var separatorText = t.Choice("separator", ["auto", ",", ";", "tab"], "auto");
        char? separator = separatorText switch { "," => ',', ";" => ';', "tab" => '\t', _ => null };
        var decimalText = t.Choice("decimal", [".", ","], ".");
        var decimalSeparator = decimalText[0];
        if (separator == ',' && decimalSeparator == ',')
        {
            t.Report("decimal", "a decimal comma needs another column separator (';' or tab)");
        }
        var testDate = ReadDate(t, "test_date");
        t.RejectUnknownKeys();
        return new LogFormat(timeColumn, format, separator, decimalSeparator) { TestDate = testDate, TestDateLocation = testDate is null ? null : t.LocationOf("test_date") };
    }

    private static ChannelSpec? ReadChannel(TableReader t, HashSet<string> declaredIds)
    {
        var id = t.String("id", required: true);
        if (id is not null)
        {
            declaredIds.Add(id);
        }
        var column = t.String("column") ?? id;
        var roleText = t.TryChoice("measures", Roles, "other");
        if (roleText is null)
        {
            // Units and coefficients cannot be judged without knowing what is measured: report only the role.
            t.AcceptAllKeys();
            return null;
        }
        var role = ParseRole(roleText);
        var dimension = SensorDimension(t, role) ?? DimensionOf(role);
        var plane = t.String("plane");
        var position = t.Quantity("position", Dimension.Length);
        var reference = t.String("reference");
        var isKey = t.Bool("key", false);
        var radius = t.Quantity("radius", Dimension.Length, minSi: 0);
        var sensor = ReadSensor(t, dimension);
        var uncertainty = t.Tables("uncertainty").Select(u => ReadUncertainty(u, dimension)).Where(u => u is not null).Select(u => u!).ToList();
        TareSpec? tare = null;
        if (t.Table("tare") is { } tareTable)
        {
            var start = ReadTime(tareTable, "from");
            var end = ReadTime(tareTable, "to");
            if (start is not null && end is not null && start.IsAbsolute == end.IsAbsolute && end.Seconds <= start.Seconds)
            {
                tareTable.Report("to", "the tare window ends before it starts ('to' must come after 'from')");
            }
            tareTable.RejectUnknownKeys();
            tare = start is null || end is null ? null : new TareSpec(start, end);
        }
        TareSpec? tareEnd = null;
        double? zeroUncertainty = null;
        if (t.Table("tare_end") is { } endTable)
        {
            var endStart = ReadTime(endTable, "from");
            var endEnd = ReadTime(endTable, "to");
            zeroUncertainty = endTable.Quantity("zero_uncertainty", dimension == Dimension.Temperature ? Dimension.TemperatureDifference : dimension, minSi: 0);
            endTable.RejectUnknownKeys();
            tareEnd = endStart is null || endEnd is null ? null : new TareSpec(endStart, endEnd);
            if (!t.Has("tare"))
            {
                t.Report("tare_end", "a tare at the end of the day pairs with one at the start: give tare = { from, to } too");
            }
        }
        var record = ReadRecord(t);
        var limits = ConditioningReader.ReadLimits(t.Table("limits"), dimension, sensor);
        if (role == ChannelRole.WallTemperature && position is null)
        {
            t.Report("position", "a wall_temperature channel needs its axial position, e.g. position = \"0.5 m\"");
        }
        if (role is ChannelRole.StaticPressure or ChannelRole.BulkTemperature && plane is null)
        {
            t.Report("plane", $"a {roleText} channel needs the plane it measures, e.g. plane = \"inlet\"");
        }
        if (radius is not null && role != ChannelRole.BulkTemperature)
        {
            t.Report("radius", "a radial position belongs to a rake sensor: measures = \"bulk_temperature\" at any plane (e.g. plane = \"outlet\")");
        }
        t.RejectUnknownKeys();
        return id is null || sensor is null
            ? null
            : new ChannelSpec(id, column!, role, dimension, plane, position, reference, sensor, uncertainty, tare, record, isKey, t.Location with { Key = $"channel '{id}'" }) { RadiusM = radius, Limits = limits, TareEnd = tareEnd, ZeroUncertaintySi = zeroUncertainty };
    }

    private static SensorSpec? ReadSensor(TableReader t, Dimension dimension)
    {
        var kind = t.Choice("sensor", SensorKinds, "direct");
        switch (kind)
        {
            case "thermocouple":
            {
                var rawUnit = t.String("raw_unit") ?? "mV";
                var rawToSi = AffineOf(t, "raw_unit", rawUnit, Dimension.Voltage);
                var type = t.Choice("type", RigChoices.ThermocoupleTypes, ThermocoupleType.K);
                var cjChannel = t.String("cold_junction");
                var cjFixed = t.Quantity("cold_junction_temperature", Dimension.Temperature, minSi: 173.15, maxSi: 423.15);
                if (cjChannel is null && cjFixed is null)
                {
                    t.Report("cold_junction", "a thermocouple needs cold-junction compensation: cold_junction = \"<RTD channel id>\" or cold_junction_temperature = \"0 degC\"");
                }
                var tolerance = t.Choice("tolerance_class", ["1", "2", "3"], "2");
                return rawToSi is null ? null : new ThermocoupleSensor(rawUnit, rawToSi.Value, type, cjChannel, cjFixed, t.Has("tolerance_class") ? tolerance : null)
                {
                    Certificate = CertificateKeys.ReadThermocouple(t.Table("correction")),
                };
            }
            case "rtd":
            {
                var rawUnit = t.String("raw_unit") ?? "ohm";
                var rawToSi = AffineOf(t, "raw_unit", rawUnit, Dimension.Resistance);
                var r0 = t.Quantity("r0", Dimension.Resistance, minSi: 1, maxSi: 1e5) ?? 100.0;
                var tolerance = t.Choice("tolerance_class", ["AA", "A", "B", "C"], "B");
                return rawToSi is null ? null : new RtdSensor(rawUnit, rawToSi.Value, r0, t.Has("tolerance_class") ? tolerance : null)
                {
                    Certificate = CertificateKeys.ReadRtd(t.Table("coefficients")),
                };
            }
            case "direct":
            {
                var unit = t.String("unit") ?? UnitText.SiSymbol(dimension);
                var unitToSi = AffineOf(t, "unit", unit, dimension);
                return unitToSi is null ? null : new DirectSensor(unit, unitToSi.Value);
            }
            default:
            {
                var rawUnit = t.String("raw_unit", required: true) ?? "V";
                var unit = t.String("unit") ?? UnitText.SiSymbol(dimension);
                var unitToSi = AffineOf(t, "unit", unit, dimension);
                // Raw signals of generic sensors may be volts, amps or ohms: accept any of those.
                var rawToSi = AffineOfAny(t, "raw_unit", rawUnit, [Dimension.Voltage, Dimension.Current, Dimension.Resistance, Dimension.Frequency, dimension]);
                if (unitToSi is null || rawToSi is null)
                {
                    return null;
                }
                return kind switch
                {
                    "linear" => t.Number("gain", required: true) is { } gain && (gain != 0 || Reported(t, "gain", "a gain of 0 maps every raw signal to the same value, so the channel would measure nothing"))
                        ? new LinearSensor(rawUnit, unit, rawToSi.Value, unitToSi.Value, gain, t.Number("offset") ?? 0.0)
                        : null,
                    "polynomial" => ReadNumbers(t, "coefficients") is { } c && (c.Count > 0 || Reported(t, "coefficients", "a polynomial needs at least one coefficient (c0, c1, … of value = c0 + c1·raw + …); the list is empty"))
                        ? new PolynomialSensor(rawUnit, unit, rawToSi.Value, unitToSi.Value, c)
                        : null,
                    _ => ReadTable(t, rawUnit, unit, rawToSi.Value, unitToSi.Value),
                };
            }
        }
    }

    /// <summary>Reports a problem and returns false, so that a refusal reads as one condition.</summary>
    private static bool Reported(TableReader t, string key, string message)
    {
        t.Report(key, message);
        return false;
    }

    private static TableSensor? ReadTable(TableReader t, string rawUnit, string unit, Affine rawToSi, Affine unitToSi)
    {
        var points = t.Array("points", required: true);
        var degree = t.Integer("degree", min: 1, max: 5) ?? 1;
        if (points is null)
        {
            return null;
        }
        var raw = new List<double>();
        var values = new List<double>();
        foreach (var point in points)
        {
            if (point.Value is List<TomlEntry> { Count: 2 } pair && pair[0].Value is double x && pair[1].Value is double y)
            {
                raw.Add(x);
                values.Add(y);
            }
            else
            {
                t.Report("points", $"each calibration point must be [raw, value]; {point.Path} is not");
                return null;
            }
        }
        if (raw.Count < degree + 2)
        {
            t.Report("points", $"a degree-{degree} fit needs at least {degree + 2} points to estimate its residual; found {raw.Count}");
            return null;
        }
        return new TableSensor(rawUnit, unit, rawToSi, unitToSi, raw, values, degree);
    }

    private static List<double>? ReadNumbers(TableReader t, string key)
    {
        var items = t.Array(key, required: true);
        if (items is null)
        {
            return null;
        }
        var numbers = new List<double>();
        foreach (var item in items)
        {
            if (item.Value is double d)
            {
                numbers.Add(d);
            }
            else
            {
                t.Report(key, $"{item.Path} is not a number");
                return null;
            }
        }
        return numbers;
    }

    private static UncertaintyTerm? ReadUncertainty(TableReader t, Dimension dimension)
    {
        var spread = dimension == Dimension.Temperature ? Dimension.TemperatureDifference : dimension;
        var kind = PercentTermReader.InferKind(t) ?? t.Choice("kind", ["certificate", "reading", "span", "absolute", "resolution", "class"], "absolute");
        var source = t.String("source") ?? kind;
        var reliability = t.Quantity("reliability", Dimension.Dimensionless, minSi: 0.01, maxSi: 1);
        // GUM G.4.2: nu = 1/2 (relative uncertainty of u)^-2; no statement means the term is taken as exact.
        var dof = reliability is { } r ? 0.5 / (r * r) : double.PositiveInfinity;
        var distribution = t.Choice("distribution", RigChoices.Distributions, kind == "certificate" ? DistributionKind.Normal : DistributionKind.Rectangular);
        UncertaintyTerm? term = kind switch
        {
            "certificate" => t.Quantity("expanded", spread, required: true, minSi: 0) is { } u
                ? new UncertaintyTerm(UncertaintyTermKind.Certificate, u, t.Number("k", min: 1, max: 10) ?? 2.0, DistributionKind.Normal, dof, source, null)
                : null,
            "" => null,
            "reading" => PercentTermReader.Fraction(t, "value", PercentBasis.Reading) is { } f
                ? new UncertaintyTerm(UncertaintyTermKind.PercentOfReading, f, 1, distribution, dof, source, null)
                : null,
            "span" => (PercentTermReader.Fraction(t, "value", PercentBasis.FullScale), PercentTermReader.FullScale(t, spread)) is ({ } f, { } s)
                ? new UncertaintyTerm(UncertaintyTermKind.PercentOfSpan, f * s, 1, distribution, dof, source, null)
                : null,
            "absolute" => t.Quantity("value", spread, required: true, minSi: 0) is { } a
                ? new UncertaintyTerm(UncertaintyTermKind.Absolute, a, 1, distribution, dof, source, null)
                : null,
            "resolution" => t.Quantity("value", spread, required: true, minSi: 0) is { } step
                ? new UncertaintyTerm(UncertaintyTermKind.Resolution, step, 1, DistributionKind.Rectangular, dof, source, null)
                : null,
            _ => t.String("class", required: true) is { } c
                ? new UncertaintyTerm(UncertaintyTermKind.ToleranceClass, 0, 1, DistributionKind.Rectangular, dof, source, c)
                : null,
        };
        t.RejectUnknownKeys();
        return term;
    }

    private static CalibrationRecord? ReadRecord(TableReader t)
    {
        var certificate = t.String("certificate");
        var calibrated = ReadDate(t, "calibrated");
        var due = ReadDate(t, "calibration_due");
        var (interval, dueFromInterval) = CalibrationDueReader.Interval(t, calibrated, due);
        due ??= dueFromInterval;
        var dueKey = interval is null ? "calibration_due" : "calibration_interval";
        return certificate is null && calibrated is null && due is null
            ? null
            : new CalibrationRecord(certificate, calibrated, due) { Interval = interval, DueLocation = due is null ? null : t.LocationOf(dueKey) };
    }

    private static DateOnly? ReadDate(TableReader t, string key)
    {
        var entry = t.Has(key) ? t.Node.TryGet(key, out var e) ? e : null : null;
        if (entry is null)
        {
            return null;
        }
        var text = entry.Value as string ?? "";
        if (DateOnly.TryParseExact(text.Trim(), "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date))
        {
            return date;
        }
        t.Report(key, $"'{text}' is not a date written yyyy-mm-dd");
        return null;
    }

    private static PointSpec? ReadPoint(TableReader t)
    {
        var id = t.String("id", required: true);
        if (id is not null && !PointIds.IsSafeFolderName(id))
        {
            t.Report("id", $"'{id}' is not a safe folder name: a point id names its output folder (points/ID/), so use letters, digits, '-', '_' and '.', and not '.' or '..' alone");
        }
        var start = ReadTime(t, "start");
        var end = ReadTime(t, "end");
        if (start is not null && end is not null && start.IsAbsolute == end.IsAbsolute && end.Seconds <= start.Seconds)
        {
            t.Report("end", "the window ends before it starts");
        }
        t.RejectUnknownKeys();
        return id is null || start is null || end is null ? null : new PointSpec(id, start, end, t.Location with { Key = $"point '{id}'" });
    }

    private static TimeBound? ReadTime(TableReader t, string key)
    {
        if (!t.Has(key))
        {
            t.Report(key, $"required key '{key}' is missing (a time since the first sample, e.g. \"40 min\", or an ISO-8601 time)");
            return null;
        }
        t.Node.TryGet(key, out var entry);
        if (entry.Value is string text && DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal, out var when) && text.Contains('-', StringComparison.Ordinal))
        {
            return new TimeBound(when.ToUnixTimeMilliseconds() / 1000.0, true);
        }
        return t.Quantity(key, Dimension.Duration, required: true, minSi: 0) is { } seconds ? new TimeBound(seconds, false) : null;
    }

    private static SteadySpec ReadSteady(TableReader? t, IReadOnlyList<ChannelSpec> channels, HashSet<string> declaredIds)
    {
        if (t is null)
        {
            return new SteadySpec(1.0, 300.0, 300.0, 180.0, []);
        }
        var block = t.Quantity("block", Dimension.Duration, minSi: 0.01, maxSi: 600) ?? 1.0;
        var window = t.Quantity("window", Dimension.Duration, minSi: 1, maxSi: 86400) ?? 300.0;
        var minDuration = t.Quantity("min_duration", Dimension.Duration, minSi: 1, maxSi: 86400) ?? window;
        var tail = t.Quantity("settled_tail", Dimension.Duration, minSi: 1, maxSi: 86400) ?? minDuration;
        var keys = new List<SteadyKey>();
        foreach (var k in t.Tables("key"))
        {
            var channelId = k.String("channel", required: true);
            var channel = channels.FirstOrDefault(c => c.Id == channelId);
            if (channelId is not null && channel is null)
            {
                if (!declaredIds.Contains(channelId))
                {
                    k.Report("channel", $"no channel with id '{channelId}'{TableReader.Suggest(channelId, declaredIds)}");
                }
                k.AcceptAllKeys();
                continue;
            }
            var spread = channel?.Dimension == Dimension.Temperature ? Dimension.TemperatureDifference : channel?.Dimension ?? Dimension.Dimensionless;
            var change = k.Quantity("max_change", spread, required: true, minSi: 0);
            var scatter = k.Quantity("max_scatter", spread, required: true, minSi: 0);
            if (scatter == 0)
            {
                k.Report("max_scatter", "a scatter limit of 0 admits no real signal, so no window would ever be steady; give the largest scatter to accept");
            }
            var step = k.Quantity("step", spread, minSi: 0);
            var minimum = k.Quantity("min", channel?.Dimension ?? Dimension.Dimensionless);
            var holdTarget = k.Quantity("hold_target", spread, minSi: 0);
            if (holdTarget == 0)
            {
                k.Report("hold_target", "a hold target of zero is reached by no hold: give the expanded uncertainty wanted, e.g. \"0.1 K\"");
            }
            k.RejectUnknownKeys();
            if (channelId is not null && change is not null && scatter is not null)
            {
                keys.Add(new SteadyKey(channelId, change.Value, scatter.Value, step ?? 4 * scatter.Value, minimum) { HoldTargetSi = holdTarget > 0 ? holdTarget : null });
            }
        }
        var detect = t.Bool("detect", fallback: true);
        t.RejectUnknownKeys();
        return new SteadySpec(block, window, minDuration, tail, keys, detect);
    }

    private static ProfileSettings ReadProfiles(TableReader? t)
    {
        if (t is null)
        {
            return new ProfileSettings(41, VelocityProfileModel.Auto, null, null);
        }
        var points = t.Integer("points", min: 3, max: MaxRadialPoints) ?? 41;
        var model = t.Choice("velocity_model", RigChoices.VelocityModels, VelocityProfileModel.Auto);
        var intensity = t.Quantity("turbulence_intensity", Dimension.Dimensionless, minSi: 0, maxSi: 1);
        var length = t.Quantity("length_scale", Dimension.Length, minSi: 0);
        t.RejectUnknownKeys();
        return new ProfileSettings(points, model, intensity, length);
    }

    private static void CheckReferences(List<ChannelSpec> channels, DuctGeometry? duct, List<PointSpec> points, List<Problem> problems)
    {
        var ids = new HashSet<string>(StringComparer.Ordinal);
        foreach (var channel in channels)
        {
            if (!ids.Add(channel.Id))
            {
                problems.Add(new Problem(channel.Location, $"channel id '{channel.Id}' is used twice"));
            }
        }
        foreach (var channel in channels)
        {
            if (channel.ReferenceChannel is { } reference && channels.All(c => c.Id != reference))
            {
                problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'.reference" }, $"no channel with id '{reference}'{TableReader.Suggest(reference, ids)}"));
            }
            if (channel.Sensor is ThermocoupleSensor { ColdJunctionChannel: { } cj } && channels.All(c => c.Id != cj))
            {
                problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'.cold_junction" }, $"no channel with id '{cj}'{TableReader.Suggest(cj, ids)}"));
            }
            if (channel.Sensor is ThermocoupleSensor { ColdJunctionChannel: { } junction } && channels.FirstOrDefault(c => c.Id == junction) is { } junctionChannel &&
                (junctionChannel.Dimension != Dimension.Temperature || junctionChannel.Id == channel.Id))
            {
                problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'.cold_junction" },
                    junctionChannel.Id == channel.Id
                        ? "a thermocouple cannot be its own cold junction"
                        : $"the cold junction '{junction}' measures {junctionChannel.Dimension.ToString().ToLowerInvariant()}, not a temperature (give the RTD or thermistor at the terminal block)"));
            }
            if (channel.Role == ChannelRole.WallTemperature && channel.AxialPositionM is { } z && duct is not null &&
                duct.PlanePositionsM.TryGetValue("inlet", out var zIn) && duct.PlanePositionsM.TryGetValue("outlet", out var zOut) && (z < zIn || z > zOut))
            {
                problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'.position" },
                    string.Create(CultureInfo.InvariantCulture, $"the wall thermocouple at {z} m lies {(z > zOut ? "beyond the outlet plane" : "before the inlet plane")} ({zIn} m to {zOut} m): the wall boundary condition covers only the duct between them")));
            }
            if (channel.Plane is { } plane && duct is not null && !duct.PlanePositionsM.ContainsKey(plane))
            {
                problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'.plane" }, $"no plane '{plane}' in [duct.planes]{TableReader.Suggest(plane, duct.PlanePositionsM.Keys)}"));
            }
        }
        foreach (var channel in channels.Where(c => c.ReferenceChannel is not null))
        {
            // Follow the reference chain: a channel that leads back to itself has no zero to refer to.
            var seen = new List<string> { channel.Id };
            for (var next = channel.ReferenceChannel; next is not null; next = channels.FirstOrDefault(c => c.Id == next)?.ReferenceChannel)
            {
                if (next == channel.Id)
                {
                    problems.Add(new Problem(channel.Location with { Key = $"channel '{channel.Id}'.reference" }, seen.Count == 1
                        ? "a channel cannot be its own reference"
                        : $"the references form a cycle ({string.Join(" → ", seen.Append(channel.Id))}): a gauge reading needs an absolute reference at the end of the chain"));
                    break;
                }
                if (seen.Contains(next) || seen.Count > channels.Count)
                {
                    break;
                }
                seen.Add(next);
            }
        }
        var pointIds = new HashSet<string>(StringComparer.Ordinal);
        foreach (var point in points.Where(p => !pointIds.Add(p.Id)))
        {
            problems.Add(new Problem(point.Location, $"point id '{point.Id}' is used twice"));
        }
    }

    private static Affine? AffineOf(TableReader t, string key, string unit, Dimension dimension) => AffineOfAny(t, key, unit, [dimension]);

    private static Affine? AffineOfAny(TableReader t, string key, string unit, IReadOnlyList<Dimension> dimensions)
    {
        foreach (var dimension in dimensions)
        {
            if (UnitText.TryUnitToSi(0.0, unit, dimension, out var shift, out _) && UnitText.TryUnitToSi(1.0, unit, dimension, out var one, out _))
            {
                return new Affine(one - shift, shift);
            }
        }
        t.Report(key, $"'{unit}' is not a unit of {string.Join(" or ", dimensions.Distinct().Select(d => d.ToString().ToLowerInvariant()))}");
        return null;
    }

    private static ChannelRole ParseRole(string text) => text switch
    {
        "barometric_pressure" => ChannelRole.BarometricPressure,
        "static_pressure" => ChannelRole.StaticPressure,
        "differential_pressure" => ChannelRole.DifferentialPressure,
        "bulk_temperature" => ChannelRole.BulkTemperature,
        "wall_temperature" => ChannelRole.WallTemperature,
        "cold_junction_temperature" => ChannelRole.ColdJunctionTemperature,
        "mass_flow" => ChannelRole.MassFlow,
        "heater_voltage" => ChannelRole.HeaterVoltage,
        "heater_current" => ChannelRole.HeaterCurrent,
        "heater_power" => ChannelRole.HeaterPower,
        "relative_humidity" => ChannelRole.RelativeHumidity,
        _ => ChannelRole.Other,
    };

    private static readonly Dimension[] UnitDimensions =
        [Dimension.Temperature, Dimension.Pressure, Dimension.MassFlow, Dimension.Voltage, Dimension.Current, Dimension.Power,
         Dimension.Length, Dimension.Resistance, Dimension.Frequency];

    /// <summary>
    /// The sensor, not the role, sets a channel's dimension: a thermocouple or RTD reads a temperature whatever it
    /// <c>measures</c>, and an <c>other</c> channel takes the dimension of its <c>unit</c> (so that its uncertainty
    /// terms and limits may carry units). A temperature sensor on a role of another dimension is an error. Null: the
    /// role decides. The keys are only peeked at here; <see cref="ReadSensor"/> reads and reports them.
    /// </summary>
    private static Dimension? SensorDimension(TableReader t, ChannelRole role)
    {
        var kind = t.Node.TryGet("sensor", out var sensorEntry) ? sensorEntry.Value as string : null;
        if (kind is "thermocouple" or "rtd")
        {
            var roleDimension = DimensionOf(role);
            if (role != ChannelRole.Other && roleDimension != Dimension.Temperature)
            {
                t.Report("sensor", $"a {kind} reads a temperature, but this channel measures a {roleDimension.ToString().ToLowerInvariant()} quantity: use a sensor of that kind, or measures = \"other\"");
            }
            return Dimension.Temperature;
        }
        if (role == ChannelRole.Other && t.Node.TryGet("unit", out var unitEntry) && unitEntry.Value is string unit)
        {
            foreach (var dimension in UnitDimensions)
            {
                if (UnitText.TryToSi("1 " + unit, dimension, out _, out _))
                {
                    return dimension;
                }
            }
        }
        return null;
    }

    private static Dimension DimensionOf(ChannelRole role) => role switch
    {
        ChannelRole.BarometricPressure or ChannelRole.StaticPressure or ChannelRole.DifferentialPressure => Dimension.Pressure,
        ChannelRole.BulkTemperature or ChannelRole.WallTemperature or ChannelRole.ColdJunctionTemperature => Dimension.Temperature,
        ChannelRole.MassFlow => Dimension.MassFlow,
        ChannelRole.HeaterVoltage => Dimension.Voltage,
        ChannelRole.HeaterCurrent => Dimension.Current,
        ChannelRole.HeaterPower => Dimension.Power,
        _ => Dimension.Dimensionless,
    };
}
