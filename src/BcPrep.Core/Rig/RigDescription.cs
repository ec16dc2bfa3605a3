using BcPrep.Profiles;

namespace BcPrep.Rig;

/// <summary>
/// Everything the rig file declares: the duct, the fluid, each logged channel with its calibration and uncertainty,
/// the operating points pinned by hand, and the settings of each stage. All values are SI.
/// </summary>
public sealed record RigDescription(
    string Name,
    string SourceFile,
    DuctGeometry Duct,
    LogFormat Log,
    IReadOnlyList<ChannelSpec> Channels,
    IReadOnlyList<PointSpec> Points,
    SteadySpec Steady,
    ProfileSettings Profiles,
    double CoverageProbability)
{
    public ChannelSpec? Channel(string id) => Channels.FirstOrDefault(c => c.Id == id);

    public IEnumerable<ChannelSpec> WithRole(ChannelRole role) => Channels.Where(c => c.Role == role);

    /// <summary>The differential-pressure flow meter, when the rig file has a <c>[flow_meter]</c> table.</summary>
    public FlowMeterSpec? FlowMeter { get; init; }

    /// <summary>Axial wall-temperature grid (<c>[wall]</c>).</summary>
    public WallSettings Wall { get; init; } = WallSettings.Default;

    /// <summary>Sampling of the inlet profile onto a face's points (<c>[inlet_profile.face]</c>), if asked for.</summary>
    public InletFaceSpec? InletFace { get; init; }

    /// <summary>Signal conditioning settings ([conditioning]).</summary>
    public ConditioningSpec Conditioning { get; init; } = ConditioningSpec.Default;
}

/// <summary>Duct geometry; positions are axial coordinates (m) along the duct in one frame of the user's choice.</summary>
public sealed record DuctGeometry(
    double InnerDiameterM,
    double InnerDiameterStdM,
    double WallRoughnessM,
    double HeatedLengthM,
    double HeaterLossFraction,
    double HeaterLossFractionStd,
    IReadOnlyDictionary<string, double> PlanePositionsM)
{
    public double FlowAreaM2 => Math.PI * InnerDiameterM * InnerDiameterM / 4.0;
}

/// <summary>How the log files are laid out.</summary>
public sealed record LogFormat(string TimeColumn, TimeFormat TimeFormat, char? Separator, char DecimalSeparator)
{
    /// <summary>The date of the test day for logs that carry no dates (<c>[log] test_date</c>); needed to check
    /// calibration due dates when times are seconds on the logger's clock.</summary>
    public DateOnly? TestDate { get; init; }

    /// <summary>Where <see cref="TestDate"/> is written, for messages.</summary>
    public SourceLocation? TestDateLocation { get; init; }
}

public enum TimeFormat
{
    /// <summary>Seconds on the logger's own clock.</summary>
    Seconds,
    /// <summary>ISO-8601 date and time; converted to seconds since 1970-01-01 UTC.</summary>
    Iso8601,
}

/// <summary>What a channel measures, which decides where its value goes in the physics.</summary>
public enum ChannelRole
{
    BarometricPressure,
    StaticPressure,
    DifferentialPressure,
    BulkTemperature,
    WallTemperature,
    ColdJunctionTemperature,
    MassFlow,
    HeaterVoltage,
    HeaterCurrent,
    HeaterPower,
    RelativeHumidity,
    Other,
}

/// <summary>One logged column: where it is, what it measures and how raw numbers become SI values.</summary>
public sealed record ChannelSpec(
    string Id,
    string Column,
    ChannelRole Role,
    Dimension Dimension,
    string? Plane,
    double? AxialPositionM,
    string? ReferenceChannel,
    SensorSpec Sensor,
    IReadOnlyList<UncertaintyTerm> Uncertainty,
    TareSpec? Tare,
    CalibrationRecord? Record,
    bool IsKey,
    SourceLocation Location)
{
    /// <summary>Radial position (m from the axis) of a rake sensor; null for a plane's bulk sensor.</summary>
    public double? RadiusM { get; init; }

    /// <summary>Sensor-fault limits (the channel's <c>limits</c> table).</summary>
    public ChannelLimits Limits { get; init; } = ChannelLimits.None;

    /// <summary>A second no-flow tare at the end of the day (<c>tare_end</c>): the zero is interpolated in time between the two.</summary>
    public TareSpec? TareEnd { get; init; }

    /// <summary>
    /// The zero drift the sensor may show over the day without a warning (<c>tare_end.zero_uncertainty</c>, SI); null:
    /// the root sum of squares of the channel's <c>absolute</c> and <c>span</c> terms as standard uncertainties.
    /// </summary>
    public double? ZeroUncertaintySi { get; init; }
}

/// <summary>A pinned time interval (seconds since the first sample of the day, or absolute when the log has dates).</summary>
public sealed record TimeBound(double Seconds, bool IsAbsolute);

/// <summary>Subtract the channel's mean over a no-flow interval (a zero or tare reading).</summary>
public sealed record TareSpec(TimeBound Start, TimeBound End);

/// <summary>Calibration paperwork of a sensor (dates as written, ISO yyyy-mm-dd).</summary>
public sealed record CalibrationRecord(string? Certificate, DateOnly? CalibratedOn, DateOnly? DueOn)
{
    /// <summary>The recalibration interval when the due date was worked out from <c>calibration_interval</c>.</summary>
    public CalibrationInterval? Interval { get; init; }

    /// <summary>Where the due date (or the interval it comes from) is written, for messages.</summary>
    public SourceLocation? DueLocation { get; init; }
}

/// <summary>An operating point whose averaging window is pinned by hand in the rig file.</summary>
public sealed record PointSpec(string Id, TimeBound Start, TimeBound End, SourceLocation Location);

/// <summary>
/// Steady-window detection settings. Detection runs when <paramref name="Detect"/> is true and there are keys;
/// windows pinned in the rig file replace the detected windows they overlap.
/// </summary>
public sealed record SteadySpec(
    double BlockS,
    double WindowS,
    double MinDurationS,
    double SettledTailS,
    IReadOnlyList<SteadyKey> Keys,
    bool Detect = true);

/// <summary>
/// Per key channel limits, in SI units of that channel. <paramref name="MinimumSi"/>: the smallest mean that counts
/// as an operating point (null = none), so that a rig at rest is not taken for a point.
/// </summary>
public sealed record SteadyKey(string Channel, double MaxChangeSi, double MaxScatterSi, double StepSi, double? MinimumSi = null)
{
    /// <summary>
    /// Expanded uncertainty (SI, at the rig's coverage probability) the channel's window mean should reach; the live
    /// follower then says how long a settled point must be held for it. Null = no hold target for this channel.
    /// </summary>
    public double? HoldTargetSi { get; init; }
}

/// <summary>Inlet profile settings.</summary>
public sealed record ProfileSettings(
    int RadialPoints,
    VelocityProfileModel VelocityModel,
    double? TurbulenceIntensity,
    double? LengthScaleM);
