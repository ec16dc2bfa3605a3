using BcPrep.Calibration;
using BcPrep.Rig;
using BcPrep.Uncertainty;

namespace BcPrep.Pipeline;

/// <summary>
/// One channel's value in the measurement model: its window mean (Type A input), minus a tare mean, plus every
/// Type B error input with its sensitivity. Inputs shared between channels (a cold-junction sensor's error acting
/// on every thermocouple it serves) appear in several channels' terms, which is how their correlation arises.
/// </summary>
public sealed class ChannelInputs
{
    private readonly List<(int Index, double Coefficient)> _terms = [];

    public ChannelInputs(string channel, int meanIndex)
    {
        Channel = channel;
        MeanIndex = meanIndex;
    }

    public string Channel { get; }

    public int MeanIndex { get; }

    public int? TareIndex { get; set; }

    /// <summary>The end-of-day tare input, when the channel is tared at both ends of the day.</summary>
    public int? EndTareIndex { get; set; }

    /// <summary>Weight of the end tare at the point's time (0 = the start tare alone, 1 = the end tare alone).</summary>
    public double EndTareWeight { get; set; }

    public IReadOnlyList<(int Index, double Coefficient)> Terms => _terms;

    public void AddTerm(int index, double coefficient) => _terms.Add((index, coefficient));

    public double ValueAt(double[] x)
    {
        var value = x[MeanIndex];
        if (TareIndex is { } tare)
        {
            value -= EndTareIndex is { } end
                ? ((1.0 - EndTareWeight) * x[tare]) + (EndTareWeight * x[end])
                : x[tare];
        }
        foreach (var (index, coefficient) in _terms)
        {
            value += coefficient * x[index];
        }
        return value;
    }
}

/// <summary>Turns a channel's rig-file uncertainty terms into standard uncertainties at the reading.</summary>
public static class TypeBTerms
{
    /// <summary>Standard uncertainty (SI) of one term at the channel's mean reading.</summary>
    public static double StandardUncertainty(UncertaintyTerm term, ChannelSpec channel, double meanSi)
    {
        var halfWidthOrU = term.Kind switch
        {
            UncertaintyTermKind.Certificate => TypeB.FromCertificate(term.ValueSi, term.CoverageFactor),
            UncertaintyTermKind.PercentOfReading => term.ValueSi * Math.Abs(meanSi),
            UncertaintyTermKind.PercentOfSpan => term.ValueSi,
            UncertaintyTermKind.Absolute => term.ValueSi,
            UncertaintyTermKind.Resolution => TypeB.FromResolution(term.ValueSi),
            UncertaintyTermKind.ToleranceClass => ToleranceHalfWidth(term, channel, meanSi),
            _ => throw new ArgumentOutOfRangeException(nameof(term)),
        };
        if (term.Kind is UncertaintyTermKind.Certificate or UncertaintyTermKind.Resolution)
        {
            return halfWidthOrU;
        }
        return term.Distribution switch
        {
            DistributionKind.Normal => halfWidthOrU,
            DistributionKind.Triangular => TypeB.FromTriangularHalfWidth(halfWidthOrU),
            DistributionKind.ArcSine => TypeB.FromArcSineHalfWidth(halfWidthOrU),
            DistributionKind.Rectangular => TypeB.FromRectangularHalfWidth(halfWidthOrU),
            _ => throw new ArgumentOutOfRangeException(nameof(term), term.Distribution, "a rig-file term has no such distribution"),
        };
    }

    public static DistributionKind Distribution(UncertaintyTerm term) => term.Kind switch
    {
        UncertaintyTermKind.Certificate => DistributionKind.Normal,
        UncertaintyTermKind.Resolution => DistributionKind.Rectangular,
        _ => term.Distribution,
    };

    private static double ToleranceHalfWidth(UncertaintyTerm term, ChannelSpec channel, double temperatureK)
    {
        var cls = term.ToleranceClass ?? "";
        switch (channel.Sensor)
        {
            case ThermocoupleSensor tc:
                var tcClass = cls switch
                {
                    "1" => ThermocoupleToleranceClass.Class1,
                    "2" => ThermocoupleToleranceClass.Class2,
                    "3" => ThermocoupleToleranceClass.Class3,
                    _ => throw new BcPrepFailure(FailureKind.Configuration, channel.Location, $"thermocouple tolerance class '{cls}' is not 1, 2 or 3 (IEC 60584-1)"),
                };
                return ToleranceClasses.ThermocoupleHalfWidthK(tc.Type, tcClass, temperatureK);
            case RtdSensor:
                if (!Enum.TryParse<RtdToleranceClass>(cls, out var rtdClass))
                {
                    throw new BcPrepFailure(FailureKind.Configuration, channel.Location, $"RTD tolerance class '{cls}' is not AA, A, B or C (IEC 60751)");
                }
                return ToleranceClasses.RtdHalfWidthK(rtdClass, RtdElementKind.WireWound, temperatureK);
            default:
                throw new BcPrepFailure(FailureKind.Configuration, channel.Location, "a tolerance class applies only to thermocouples and RTDs");
        }
    }
}
