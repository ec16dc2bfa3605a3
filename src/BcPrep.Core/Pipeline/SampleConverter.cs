namespace BcPrep.Pipeline;

/// <summary>
/// Turns one logged number into its SI engineering value. The second argument is, for thermocouples, the emf (V)
/// of the reference junction at its temperature in the same row, E(T_cj), added to the measured emf before
/// inversion (cold-junction compensation adds emfs, not temperatures); 0 otherwise. It is computed once per row
/// and shared by every thermocouple on that reference junction. Throws <see cref="BcPrepDataException"/> for a value
/// outside the calibration's valid range; the scan adds channel, time, file and line to the message.
/// </summary>
public delegate double SampleConverter(double raw, double referenceJunctionEmfV);
