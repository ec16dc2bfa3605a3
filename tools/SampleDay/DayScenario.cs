namespace BcPrep.Tools.SampleDay;

/// <summary>
/// The invented test day of the Marten heated-duct stand: a quiet start (zero readings), then three operating
/// points, each a step in fan and heater setting followed by a slow thermal settling.
/// </summary>
internal sealed record DayScenario(
    double DurationS,
    double SampleRateHz,
    IReadOnlyList<SetPoint> SetPoints)
{
    public static DayScenario Default { get; } = new(
        DurationS: 165 * 60,
        SampleRateHz: 2.0,
        SetPoints:
        [
            new SetPoint(StartS: 0, MassFlowKgS: 0.0, HeaterPowerW: 0.0),
            new SetPoint(StartS: 10 * 60, MassFlowKgS: 0.020, HeaterPowerW: 600.0),
            new SetPoint(StartS: 60 * 60, MassFlowKgS: 0.030, HeaterPowerW: 900.0),
            new SetPoint(StartS: 110 * 60, MassFlowKgS: 0.040, HeaterPowerW: 1200.0),
        ]);

    public SetPoint At(double timeS) => SetPoints.Last(s => s.StartS <= timeS);
}

/// <summary>Fan and heater setting from a start time on.</summary>
internal sealed record SetPoint(double StartS, double MassFlowKgS, double HeaterPowerW);
