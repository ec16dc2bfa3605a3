namespace BcPrep.Rig;

/// <summary>
/// The rig file's [conditioning] table in SI. Defaults (used when the table or a key is absent), our choices:
/// gaps up to 2 s bridged; Hampel half-window 10 samples and threshold 6 σ, wider and stricter than the common
/// 3 / 3 σ. On Gaussian noise 3 / 3 σ replaces about 4 % of perfectly good samples, and 10 / 4 σ still 0.3 %, which
/// clips the tails and understates the Type A uncertainty (own simulation: 10 / 4 σ 0.29 % white; 10 / 5 σ 0.07 %;
/// 10 / 6 σ 0.022–0.025 % white, 0.006–0.011 % AR(1) φ = 0.8, over 2·10⁵ samples each). 6 σ keeps the false
/// replacements well under 0.1 % at the same cost per sample; a spike smaller than 6 robust σ stays in, and moves a
/// window mean of n samples by less than 6σ/n. 4th-order Butterworth, but no low-pass and no mains notch unless asked
/// for, because the right cutoff depends on the rig and a notch at the wrong mains frequency only does harm.
/// </summary>
/// <param name="MaxBridgeS">Longest gap (s) bridged by linear interpolation; a longer one inside a window fails the point.</param>
/// <param name="HampelHalfWindow">Hampel neighbours per side (samples).</param>
/// <param name="HampelSigmas">Hampel threshold in robust standard deviations.</param>
/// <param name="LowPassOrder">Butterworth order of one pass.</param>
/// <param name="LowPassCutoffHz">Butterworth −3 dB cutoff of one pass (Hz); null = no low-pass.</param>
/// <param name="MainsHz">50 or 60 Hz; null = no notch.</param>
/// <param name="NotchQ">Notch quality factor f0 / bandwidth.</param>
/// <param name="NotchHarmonics">Multiples of the mains frequency notched (those below Nyquist).</param>
public sealed record ConditioningSpec(
    double MaxBridgeS,
    int HampelHalfWindow,
    double HampelSigmas,
    int LowPassOrder,
    double? LowPassCutoffHz,
    double? MainsHz,
    double NotchQ,
    int NotchHarmonics)
{
    /// <summary>Hampel threshold used when the rig file gives none (see the type's remarks for why 6).</summary>
    public const double DefaultHampelSigmas = 6.0;

    public static ConditioningSpec Default { get; } = new(2.0, 10, DefaultHampelSigmas, 4, null, null, 30.0, 3);
}

/// <summary>
/// Per-channel sensor-fault limits from a channel's <c>limits</c> table, in the channel's SI unit. A rail written in
/// the raw unit (e.g. "10 V" on a pressure transducer) is kept raw, in the raw unit as logged, and
/// converted through the channel's calibration when the limits are used.
/// </summary>
/// <param name="RailLow">Lower rail (full-scale minimum) or null.</param>
/// <param name="RailHigh">Upper rail or null.</param>
/// <param name="RailsRaw">True when the rails are logged numbers in the raw unit, false when they are SI values.</param>
/// <param name="RailToleranceSi">Distance from a rail that still counts as "at the rail"; null = the resolution, else 0.</param>
/// <param name="PlausibleMinSi">Lowest plausible reading; null = the default of the sensor kind.</param>
/// <param name="PlausibleMaxSi">Highest plausible reading; null = the default of the sensor kind.</param>
/// <param name="ResolutionSi">Smallest step the channel shows; null = a <c>resolution</c> uncertainty term if declared.</param>
public sealed record ChannelLimits(
    double? RailLow,
    double? RailHigh,
    bool RailsRaw,
    double? RailToleranceSi,
    double? PlausibleMinSi,
    double? PlausibleMaxSi,
    double? ResolutionSi)
{
    public static ChannelLimits None { get; } = new(null, null, false, null, null, null, null);
}
