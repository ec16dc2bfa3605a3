namespace BcPrep.Pipeline;

/// <summary>Choices for one processing run that are not part of the rig description.</summary>
public sealed record ProcessOptions(
    bool MonteCarlo = false,
    int Seed = 1,
    int MonteCarloMaxTrials = 200_000)
{
    /// <summary>Channel ids (or "all") whose expired calibration the person explicitly allows; recorded in the manifest.</summary>
    public IReadOnlyList<string> AllowExpired { get; init; } = [];

    /// <summary>The planned points; when given, matched points take the matrix names.</summary>
    public Lab.TestMatrix? Matrix { get; init; }

    /// <summary>Where the reading reports how far it has got (for a progress display); null for none.</summary>
    public Reading.ReadProgress? Progress { get; init; }

    /// <summary>
    /// Gather detected windows while the day is read, from the rows kept back (default). False reads them in a
    /// second pass instead, as a day recorded by several loggers always is; the results are the same.
    /// </summary>
    public bool SinglePass { get; init; } = true;

    /// <summary>How long (s) rows are kept back for the single pass; null for the span the steady settings need.</summary>
    internal double? KeptRowsS { get; init; }

    /// <summary>
    /// The folder for the temporary files that keep the rows of the plateau under way during the single read (8 bytes ×
    /// (channels + 1) × rate × seconds; deleted as soon as no window needs them, and by the system if the run is
    /// killed); the command line gives the system's temporary folder. Null keeps them in memory, at most 96 MB: a
    /// longer plateau's window is then read a second time from the log. The results are the same either way.
    /// </summary>
    public string? KeptRowsFolder { get; init; }
}
