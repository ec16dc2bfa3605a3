using BcPrep.Conditioning;
using BcPrep.Profiles;
using BcPrep.Steady;

namespace BcPrep;

/// <summary>
/// The one place where a choice gets the spelling a person reads and writes: the rig file's own words
/// (<c>power_law</c>, <c>auto</c>) and the steady-detection words of the <c>windows</c> table (<c>drift-scatter</c>,
/// <c>r-test</c>). Tables, the manifest, the report and messages all spell through here, never through an enum's
/// <c>ToString()</c>, so an internal name (PowerLaw, RTest) cannot leak into what a person reads.
/// </summary>
public static class ChoiceSpelling
{
    private static readonly (VelocityProfileModel Model, string Name)[] VelocityModelNames =
    [
        (VelocityProfileModel.Auto, "auto"),
        (VelocityProfileModel.Uniform, "uniform"),
        (VelocityProfileModel.Laminar, "laminar"),
        (VelocityProfileModel.PowerLaw, "power_law"),
        (VelocityProfileModel.Spalding, "spalding"),
        (VelocityProfileModel.Reichardt, "reichardt"),
    ];

    /// <summary>The values the rig file's <c>[profiles] velocity_model</c> accepts, in the order the README lists them.</summary>
    public static IReadOnlyList<string> VelocityModels { get; } = VelocityModelNames.Select(m => m.Name).ToArray();

    /// <summary>The rig-file word of <paramref name="model"/>.</summary>
    public static string Name(VelocityProfileModel model) => VelocityModelNames.Single(m => m.Model == model).Name;

    /// <summary>The model a rig-file word names; <see cref="VelocityProfileModel.Auto"/> for one it does not know (the reader has refused those already).</summary>
    public static VelocityProfileModel VelocityModel(string name) =>
        VelocityModelNames.FirstOrDefault(m => m.Name == name) is { Name: not null } found ? found.Model : VelocityProfileModel.Auto;

    /// <summary>A steady-detection method: drift-scatter, r-test or mser.</summary>
    public static string Name(SteadyMethod method) => method switch
    {
        SteadyMethod.DriftScatter => "drift-scatter",
        SteadyMethod.RTest => "r-test",
        SteadyMethod.Mser => "mser",
        _ => throw new ArgumentOutOfRangeException(nameof(method), method, "one method, not a combination"),
    };

    /// <summary>Method flags as words joined by '+', e.g. "drift-scatter+r-test+mser"; "none" when empty.</summary>
    public static string Names(SteadyMethod methods)
    {
        var names = new[] { SteadyMethod.DriftScatter, SteadyMethod.RTest, SteadyMethod.Mser }.Where(m => methods.HasFlag(m)).Select(Name).ToList();
        return names.Count == 0 ? "none" : string.Join('+', names);
    }

    /// <summary>
    /// A failed criterion in the words of the methods it belongs to: drift and scatter (the two tests of
    /// drift-scatter), r-test, mser, and the stretch-wide coverage, duration and range.
    /// </summary>
    public static string Name(SteadyCriterion criterion) => criterion switch
    {
        SteadyCriterion.Drift => "drift",
        SteadyCriterion.Scatter => "scatter",
        SteadyCriterion.RTest => "r-test",
        SteadyCriterion.Mser => "mser",
        SteadyCriterion.Coverage => "coverage",
        SteadyCriterion.Duration => "duration",
        SteadyCriterion.Range => "range",
        _ => throw new ArgumentOutOfRangeException(nameof(criterion), criterion, null),
    };

    /// <summary>A sensor fault in words: saturation, stuck, implausible, non-finite.</summary>
    public static string Name(SensorFaultKind kind) => kind switch
    {
        SensorFaultKind.Saturation => "saturation",
        SensorFaultKind.Stuck => "stuck",
        SensorFaultKind.Implausible => "implausible",
        SensorFaultKind.NonFinite => "non-finite",
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, null),
    };
}
