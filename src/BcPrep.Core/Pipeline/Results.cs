using BcPrep.Rig;
using BcPrep.Steady;
using BcPrep.Uncertainty;
using BcPrep.Values;

namespace BcPrep.Pipeline;

/// <summary>How a point's averaging window was chosen.</summary>
public enum WindowOrigin
{
    /// <summary>Pinned by hand in the rig file.</summary>
    RigFile,
    /// <summary>Found by steady detection.</summary>
    Detected,
}

/// <summary>A pass/warn verdict with the numbers behind it, for the manifest and summary.</summary>
public sealed record CheckResult(string Name, bool Passed, double Value, double Limit, string Unit, string Basis);

/// <summary>Everything worked out for one operating point.</summary>
public sealed record PointResult(
    string Id,
    TimeWindow Window,
    WindowOrigin Origin,
    IReadOnlyDictionary<string, ChannelWindowStats> Channels,
    PointModel Model,
    GumResult Gum,
    PointQuantities Nominal,
    IReadOnlyList<CheckResult> Checks,
    IReadOnlyList<string> Warnings,
    MonteCarloResult? MonteCarlo,
    IReadOnlyList<GufValidation>? Validation)
{
    public int OutputIndex(string name)
    {
        for (var i = 0; i < Model.Outputs.Count; i++)
        {
            if (Model.Outputs[i].Name == name)
            {
                return i;
            }
        }
        return -1;
    }

    public GumOutput? Output(string name) => OutputIndex(name) is var i and >= 0 ? Gum.Outputs[i] : null;

    /// <summary>The GUM result of one scalar of <see cref="PointOutputs"/>; null when the point does not define it.</summary>
    public GumOutput? Output(ScalarOutput output) => Output(output.Name);
}

/// <summary>The result of processing a test day.</summary>
public sealed record DayResult(
    RigDescription Rig,
    DayStart Start,
    IReadOnlyList<PointResult> Points,
    BlockSeries Blocks,
    SteadyDetectionResult? Detection,
    IReadOnlyList<string> Warnings)
{
    /// <summary>Operating points that failed alone (too little of the window left after its gaps); the others are in <see cref="Points"/>.</summary>
    public IReadOnlyList<FailedPoint> FailedPoints { get; init; } = [];

    /// <summary>Every channel's certificate and due date, checked against the test day's dates.</summary>
    public Lab.CalibrationReport? Calibration { get; init; }

    /// <summary>How the points matched the test matrix, when one was given.</summary>
    public Lab.MatrixReport? Matrix { get; init; }

    /// <summary>Jumps the second pass made over blocks it did not need (0 when it read on or was not needed).</summary>
    public int SecondPassSeeks { get; init; }

    /// <summary>Detected windows read in a second pass because they were not gathered during the first read.</summary>
    public int WindowsReadAgain { get; init; }

    /// <summary>Most channels of gathered windows loaded at once (each is loaded when its statistics start); for tests.</summary>
    internal int PeakWindowChannelsLoaded { get; init; }
}

/// <summary>Block means of every channel over the day (for detection evidence and plots).</summary>
public sealed record BlockSeries(double[] TimesS, IReadOnlyDictionary<string, double[]> Means);
