using BcPrep.Conditioning;
using BcPrep.Profiles;
using BcPrep.Rig;
using BcPrep.Steady;

namespace BcPrep;

/// <summary>
/// The one place where a choice gets the spelling a person reads: the rig file's own words (<c>power_law</c>,
/// <c>auto</c>, kept in <see cref="RigChoices"/>) and the steady-detection words of the <c>windows</c> table
/// (<c>drift-scatter</c>, <c>r-test</c>). Tables, the manifest, the report and messages all spell through here, never through an enum's
/// <c>ToString()</c>, so an internal name (PowerLaw, RTest) cannot leak into what a person reads.
/// </summary>
public static class ChoiceSpelling
{
    /// <summary>The rig-file word of <paramref name="model"/> (auto, power_law, …), from the rig's own spelling table.</summary>
    public static string Name(VelocityProfileModel model) => model.RigName();

    /// <summary>A steady-detection method: drift-scatter, r-test, mser or settling.</summary>
    public static string Name(SteadyMethod method) => method switch
    {
        SteadyMethod.DriftScatter => "drift-scatter",
        SteadyMethod.RTest => "r-test",
        SteadyMethod.Mser => "mser",
        SteadyMethod.Settling => "settling",
        _ => throw new ArgumentOutOfRangeException(nameof(method), method, "one method, not a combination"),
    };

    /// <summary>Method flags as words joined by '+', e.g. "drift-scatter+r-test+mser"; "none" when empty.</summary>
    public static string Names(SteadyMethod methods)
    {
        var names = new[] { SteadyMethod.DriftScatter, SteadyMethod.RTest, SteadyMethod.Mser, SteadyMethod.Settling }.Where(m => methods.HasFlag(m)).Select(Name).ToList();
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
        SteadyCriterion.Settling => "settling",
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
