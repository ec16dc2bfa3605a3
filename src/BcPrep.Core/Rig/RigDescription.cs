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
    SteadySettings Steady,
    ProfileSettings Profiles,
    double CoverageProbability)
{
    public ChannelSpec? Channel(string id) => Channels.FirstOrDefault(c => c.Id == id);

    public IEnumerable<ChannelSpec> WithRole(ChannelRole role) => Channels.Where(c => c.Role == role);

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
public sealed record LogFormat(string TimeColumn, TimeFormat TimeFormat, char? Separator, char DecimalSeparator);

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
    /// <summary>Sensor-fault limits (the channel's <c>limits</c> table).</summary>
    public ChannelLimits Limits { get; init; } = ChannelLimits.None;
}

/// <summary>A pinned time interval (seconds since the first sample of the day, or absolute when the log has dates).</summary>
public sealed record TimeBound(double Seconds, bool IsAbsolute);

/// <summary>Subtract the channel's mean over a no-flow interval (a zero or tare reading).</summary>
public sealed record TareSpec(TimeBound Start, TimeBound End);

/// <summary>Calibration paperwork of a sensor (dates as written, ISO yyyy-mm-dd).</summary>
public sealed record CalibrationRecord(string? Certificate, DateOnly? CalibratedOn, DateOnly? DueOn);

/// <summary>An operating point whose averaging window is pinned by hand in the rig file.</summary>
public sealed record PointSpec(string Id, TimeBound Start, TimeBound End, SourceLocation Location);

/// <summary>Steady-window detection settings (used when no window is pinned).</summary>
public sealed record SteadySettings(
    double BlockS,
    double WindowS,
    double MinDurationS,
    double SettledTailS,
    IReadOnlyList<SteadyKey> Keys);

/// <summary>Per key channel limits, in SI units of that channel.</summary>
public sealed record SteadyKey(string Channel, double MaxChangeSi, double MaxScatterSi, double StepSi);

/// <summary>Inlet profile settings.</summary>
public sealed record ProfileSettings(
    int RadialPoints,
    string VelocityModel,
    double? TurbulenceIntensity,
    double? LengthScaleM);
