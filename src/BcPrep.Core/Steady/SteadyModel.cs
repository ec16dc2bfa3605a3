using BcPrep.Values;

namespace BcPrep.Steady;

/// <summary>Methods that can accept a steady window (flags: an accepted window lists all that passed).</summary>
[Flags]
public enum SteadyMethod
{
    /// <summary>No method.</summary>
    None = 0,

    /// <summary>Least-squares drift within its limit (with uncertainty) and scatter within its limit.</summary>
    DriftScatter = 1,

    /// <summary>Cao &amp; Rhinehart R below R_crit at the end of the averaging window.</summary>
    RTest = 2,

    /// <summary>MSER-5 truncation of the stretch falls inside its first half.</summary>
    Mser = 4,

    /// <summary>
    /// Every key channel's fitted first-order approach predicts a remaining change within its tolerance from the
    /// window's start on (<see cref="SettlingEstimate"/>).
    /// </summary>
    Settling = 8,
}

/// <summary>Criterion that failed.</summary>
public enum SteadyCriterion
{
    /// <summary>Slope, or slope plus k·u, beyond the drift limit.</summary>
    Drift,

    /// <summary>Standard deviation beyond the scatter limit.</summary>
    Scatter,

    /// <summary>R ≥ R_crit.</summary>
    RTest,

    /// <summary>MSER truncation at the end of the searched half.</summary>
    Mser,

    /// <summary>Too few finite samples.</summary>
    Coverage,

    /// <summary>Steady stretch shorter than the minimum duration.</summary>
    Duration,

    /// <summary>Mean below the key channel's operating minimum (e.g. fan off: steady, but not an operating point).</summary>
    Range,

    /// <summary>The predicted remaining change (|slope|·τ of the fitted approach) still beyond the channel's tolerance.</summary>
    Settling,
}

/// <summary>
/// A key channel for steady-state detection, values in engineering units (block means), aligned with the time axis.
/// </summary>
/// <param name="Name">Channel name for reports.</param>
/// <param name="Values">One value per time stamp; NaN = missing.</param>
/// <param name="DriftLimitPerS">Largest acceptable |slope| (unit/s), &gt; 0.</param>
/// <param name="ScatterLimit">Largest acceptable standard deviation (unit), &gt; 0.</param>
/// <param name="StepThreshold">Change in mean (unit) treated as a set-point change that splits a stretch; +∞ = off.</param>
/// <param name="MinimumValue">
/// Smallest window mean (unit) that counts as an operating point; −∞ = no minimum. A rig at rest (fan off, heater
/// off) is perfectly steady, yet it is not an operating point.
/// </param>
public sealed record KeyChannel(string Name, IReadOnlyList<double> Values, double DriftLimitPerS, double ScatterLimit, double StepThreshold,
    double MinimumValue = double.NegativeInfinity)
{
    /// <summary>
    /// The largest predicted remaining change (channel unit) that counts as settled, as a function of the channel's
    /// level (a tolerance may be a percentage of reading); null: DriftLimitPerS × the test window.
    /// </summary>
    public Func<double, double>? Tolerance { get; init; }

    /// <summary>
    /// When set, the channel's operating minimum is this fraction of its largest level over the whole day (the 99th
    /// percentile of its block means), applied once the day has ended (<see cref="PlateauScan"/>); null for none
    /// beyond <see cref="MinimumValue"/>.
    /// </summary>
    public double? RestFractionOfLargest { get; init; }

    /// <summary>
    /// True for a channel that only marks set-point steps (a heater's voltage or current: it jumps the moment the
    /// setting changes) and is not itself judged settled.
    /// </summary>
    public bool StepOnly { get; init; }

    /// <summary>
    /// Whether a change in this channel marks a set-point step (default true). A slow channel (a wall temperature)
    /// changes for minutes after each step, and its mean difference crosses a threshold again and again on the
    /// way; where fast channels (the flow, the heater) mark the steps, the slow ones are left out of the search.
    /// </summary>
    public bool MarksSteps { get; init; } = true;
}

/// <summary>
/// Detector settings. Defaults (common practice): 300 s test window moved in 10 s steps; a steady stretch must last
/// 600 s; the operating point averages the last 300 s (the settled tail); drift must be below its limit with k = 2
/// standard uncertainties to spare; at least 90 % finite samples per window; only DriftScatter is required
/// (R-test and MSER are reported as supporting evidence because autocorrelated noise inflates R at true steady state).
/// </summary>
public sealed record SteadySettings(
    double WindowS = 300.0,
    double StepS = 10.0,
    double MinStretchS = 600.0,
    double TailS = 300.0,
    double DriftCoverageFactor = 2.0,
    double MinFiniteFraction = 0.9,
    int MserBatchSize = 5,
    SteadyMethod RequiredMethods = SteadyMethod.DriftScatter,
    RTestSettings? RTest = null)
{
    /// <summary>R-test settings in use.</summary>
    public RTestSettings RTestOrDefault => RTest ?? new RTestSettings();
}

/// <summary>One failed criterion: its value, its limit and a sentence for the report.</summary>
public sealed record CriterionFailure(SteadyCriterion Criterion, double Value, double Limit, string Description);

/// <summary>
/// Criterion values of one channel over one window. SlopePerS ± SlopeUncertaintyPerS (standard uncertainty, AR(1)
/// inflated); R at the window end (NaN when not evaluated); MSER truncation time from the stretch start (NaN when
/// not evaluated).
/// </summary>
public sealed record ChannelCriteria(
    string Channel,
    double Mean,
    double SlopePerS,
    double SlopeUncertaintyPerS,
    double ResidualAr1,
    double DriftLimitPerS,
    double StandardDeviation,
    double ScatterLimit,
    double R,
    double RCritical,
    double MserTruncationS,
    IReadOnlyList<CriterionFailure> Failures)
{
    /// <summary>Time constant τ (s) of the first-order approach fitted after the step; NaN when not fitted.</summary>
    public double TauS { get; init; } = double.NaN;

    /// <summary>
    /// Predicted change still to come from the window's start to the plateau's end, by the fitted approach (about
    /// |slope|·τ when the plateau is long; channel unit); NaN when not fitted.
    /// </summary>
    public double RemainingChange { get; init; } = double.NaN;

    /// <summary>The remaining change that counts as settled (channel unit); NaN when not used.</summary>
    public double Tolerance { get; init; } = double.NaN;

    /// <summary>Time (s) from which this channel is settled (its remaining change within tolerance); NaN when not fitted.</summary>
    public double SettledSinceS { get; init; } = double.NaN;
}

/// <summary>
/// An accepted operating point: the averaging window [StartS, EndS] (the settled tail), the steady stretch it came from,
/// the methods that passed, and per-channel criterion values on the averaging window.
/// </summary>
public sealed record SteadyWindow(double StartS, double EndS, double StretchStartS, double StretchEndS, SteadyMethod AcceptedBy, IReadOnlyList<ChannelCriteria> Channels)
{
    /// <summary>The averaging window's start, typed: detection counts from the day's first sample.</summary>
    public DaySeconds Start => new(StartS);

    /// <summary>The averaging window's end, typed.</summary>
    public DaySeconds End => new(EndS);

    /// <summary>The steady stretch's start, typed.</summary>
    public DaySeconds StretchStart => new(StretchStartS);

    /// <summary>The steady stretch's end, typed.</summary>
    public DaySeconds StretchEnd => new(StretchEndS);
}

/// <summary>
/// A stretch that was not accepted, with the reason per channel. For a run of failing test windows the criteria
/// shown are those of the window that came closest to passing (EvaluatedStartS…EvaluatedEndS): even that one failed.
/// </summary>
public sealed record RejectedStretch(double StartS, double EndS, double EvaluatedStartS, double EvaluatedEndS, string Reason, IReadOnlyList<ChannelCriteria> Channels);

/// <summary>Accepted windows and rejected stretches, both in time order.</summary>
public sealed record SteadyDetectionResult(IReadOnlyList<SteadyWindow> Accepted, IReadOnlyList<RejectedStretch> Rejected);
