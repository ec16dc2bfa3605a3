namespace BcPrep.Rig;

/// <summary>
/// The rig file's [conditioning] table in SI. Defaults (used when the table or a key is absent), our choices:
/// gaps up to 2 s bridged; Hampel half-window 10 samples and threshold 4 σ, wider and stricter than the common
/// 3 / 3 σ because on Gaussian noise 3 / 3 σ replaces about 4 % of perfectly good samples (own simulation, 6000
/// samples: 4.4 % white, 2.8 % AR(1) φ = 0.8; 10 / 4 σ: 0.4 % and 0.1 %), which clips the tails and understates the
/// Type A uncertainty; 4th-order Butterworth, but no low-pass and no mains notch unless asked for, because the right
/// cutoff depends on the rig and a notch at the wrong mains frequency only does harm.
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
    public static ConditioningSpec Default { get; } = new(2.0, 10, 4.0, 4, null, null, 30.0, 3);
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
