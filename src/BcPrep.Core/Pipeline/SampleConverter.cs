namespace BcPrep.Pipeline;

/// <summary>
/// Turns one logged number into its SI engineering value. The second argument is the cold-junction temperature
/// (K) of the same row for thermocouples, NaN otherwise. Throws <see cref="BcPrepDataException"/> for a value
/// outside the calibration's valid range; the scan adds channel, time, file and line to the message.
/// </summary>
public delegate double SampleConverter(double raw, double coldJunctionK);
