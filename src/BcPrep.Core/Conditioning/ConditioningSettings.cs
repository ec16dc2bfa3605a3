namespace BcPrep.Conditioning;

/// <summary>
/// Settings of the conditioning chain (gaps → Hampel → mains notch → low-pass). Defaults are common practice:
/// Hampel k = 3, n_σ = 3 (MATLAB hampel defaults); 4th-order Butterworth; 50 Hz mains, Q = 30, 3 harmonics;
/// gaps up to 2 s bridged. A null cutoff or mains frequency switches that step off.
/// </summary>
/// <param name="MaxBridgeS">Longest gap (s) bridged by linear interpolation.</param>
/// <param name="HampelHalfWindow">Hampel k (samples each side).</param>
/// <param name="HampelSigmas">Hampel n_σ.</param>
/// <param name="HampelScaleFloor">Lower bound of Hampel's robust σ (engineering unit; the sensor resolution).</param>
/// <param name="LowPassOrder">Butterworth order (single pass; zero-phase doubles it).</param>
/// <param name="LowPassCutoffHz">Butterworth −3 dB cutoff of one pass (Hz); null = no low-pass.</param>
/// <param name="MainsHz">Mains frequency (50 or 60 Hz); null = no notch.</param>
/// <param name="NotchQ">Notch quality factor f0/bandwidth.</param>
/// <param name="NotchHarmonics">Number of multiples of the mains frequency notched (those below Nyquist).</param>
public sealed record ConditioningSettings(
    double MaxBridgeS = 2.0,
    int HampelHalfWindow = 3,
    double HampelSigmas = 3.0,
    double HampelScaleFloor = 0.0,
    int LowPassOrder = 4,
    double? LowPassCutoffHz = null,
    double? MainsHz = 50.0,
    double NotchQ = 30.0,
    int NotchHarmonics = 3);

/// <summary>What the conditioning chain changed in one channel, for the manifest.</summary>
/// <param name="Gaps">Gap search and bridging.</param>
/// <param name="SpikesReplaced">Samples replaced by the Hampel filter.</param>
/// <param name="SpikeTimesS">Times (s) of the replaced samples.</param>
/// <param name="NotchFrequenciesHz">Notch centre frequencies applied (empty = none).</param>
/// <param name="LowPassCutoffHz">Low-pass cutoff applied, null = none.</param>
/// <param name="FilteredSegments">Gap-free segments that were filtered.</param>
/// <param name="SamplesLeftUnfiltered">Samples in segments too short to filter; set to NaN so they are not mistaken for filtered data.</param>
/// <param name="PaddingMethod">Edge handling used for zero-phase filtering.</param>
public sealed record ConditioningReport(
    GapReport Gaps,
    int SpikesReplaced,
    IReadOnlyList<double> SpikeTimesS,
    IReadOnlyList<double> NotchFrequenciesHz,
    double? LowPassCutoffHz,
    int FilteredSegments,
    int SamplesLeftUnfiltered,
    string PaddingMethod);

/// <summary>A conditioned channel: time axis (s), values, interpolation flags and the report.</summary>
public sealed record ConditionedSeries(double[] TimesS, double[] Values, bool[] Interpolated, ConditioningReport Report);
