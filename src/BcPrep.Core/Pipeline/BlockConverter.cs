using System.Numerics;
using System.Runtime.CompilerServices;
using BcPrep.Calibration;
using BcPrep.Rig;

namespace BcPrep.Pipeline;

/// <summary>
/// Converts a block of one channel's logged numbers to SI. Sensors whose conversion is a chain of straight lines
/// (linear sensors, quantities logged directly in a unit) are converted with vector arithmetic, thermocouples through
/// the block form of the ITS-90 inverse, RTDs through the block form of the IEC 60751 inverse; all keep the per-sample
/// function's order of operations, so the results are identical to it. The other sensors call it sample by sample.
/// </summary>
public sealed class BlockConverter
{
    private readonly LinearChain? _linear;
    private readonly ThermocoupleChain? _thermocouple;
    private readonly RtdChain? _rtd;

    private BlockConverter(SampleConverter perSample, LinearChain? linear, ThermocoupleChain? thermocouple, RtdChain? rtd)
    {
        PerSample = perSample;
        _linear = linear;
        _thermocouple = thermocouple;
        _rtd = rtd;
    }

    /// <summary>The per-sample conversion, also used to find the sample behind a failed block.</summary>
    public SampleConverter PerSample { get; }

    public static BlockConverter For(ChannelSpec channel)
    {
        ArgumentNullException.ThrowIfNull(channel);
        LinearChain? linear = channel.Sensor switch
        {
            LinearSensor l => new LinearChain(l.Gain, l.Offset, l.UnitToSi),
            DirectSensor d => new LinearChain(1.0, 0.0, d.UnitToSi, Direct: true),
            _ => null,
        };
        var thermocouple = channel.Sensor is ThermocoupleSensor tc ? new ThermocoupleChain(tc.Type, tc.RawToSi) : null;
        var rtd = channel.Sensor is RtdSensor r ? new RtdChain(r.Nominal, r.RawToSi) : null;
        return new BlockConverter(ChannelConversion.For(channel), linear, thermocouple, rtd);
    }

    /// <summary>
    /// si[i] = f(raw[i], reference[i]) for every sample; NaN stays NaN. <paramref name="referenceEmfV"/> is empty
    /// when the channel has no reference-junction channel, and <paramref name="fixedReferenceEmfV"/> is used instead.
    /// Throws <see cref="BcPrepDataException"/> for a sample outside the calibration's range.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Convert(ReadOnlySpan<double> raw, ReadOnlySpan<double> referenceEmfV, double fixedReferenceEmfV, Span<double> si)
    {
        if (_linear is { } chain)
        {
            chain.Apply(raw, si);
            return;
        }
        if (_thermocouple is { } tc)
        {
            tc.Apply(raw, referenceEmfV, fixedReferenceEmfV, si);
            return;
        }
        if (_rtd is { } rtd)
        {
            rtd.Apply(raw, si);
            return;
        }
        var convert = PerSample;
        for (var i = 0; i < raw.Length; i++)
        {
            var x = raw[i];
            si[i] = double.IsNaN(x) ? double.NaN : convert(x, referenceEmfV.IsEmpty ? fixedReferenceEmfV : referenceEmfV[i]);
        }
    }

    /// <summary>
    /// y = s·(g·x + o) + h (a linear sensor's calibration, then its unit to SI), or y = s·x + h for a direct one:
    /// the operations <see cref="ChannelConversion.For"/> performs, in its order, so rounding is the same.
    /// </summary>
    private sealed record LinearChain(double Gain, double Offset, Affine ToSi, bool Direct = false)
    {
        [MethodImpl(MethodImplOptions.AggressiveOptimization)]
        public void Apply(ReadOnlySpan<double> raw, Span<double> si)
        {
            var i = 0;
            if (Vector.IsHardwareAccelerated)
            {
                var width = Vector<double>.Count;
                var gain = new Vector<double>(Gain);
                var offset = new Vector<double>(Offset);
                var scale = new Vector<double>(ToSi.Scale);
                var shift = new Vector<double>(ToSi.Shift);
                for (; i <= raw.Length - width; i += width)
                {
                    var x = new Vector<double>(raw.Slice(i, width));
                    var y = Direct ? (scale * x) + shift : (scale * ((gain * x) + offset)) + shift;
                    y.CopyTo(si.Slice(i, width));
                }
            }
            for (; i < raw.Length; i++)
            {
                si[i] = Direct ? ToSi.Apply(raw[i]) : ToSi.Apply((Gain * raw[i]) + Offset);
            }
        }
    }

    /// <summary>
    /// T = T₉₀(s·x + h + E(T_ref)): the logged signal to emf, plus the reference junction's emf, through the ITS-90
    /// inverse, as <see cref="ChannelConversion.For"/> does it, a block at a time.
    /// </summary>
    private sealed record ThermocoupleChain(ThermocoupleType Type, Affine RawToSi)
    {
        [MethodImpl(MethodImplOptions.AggressiveOptimization)]
        public void Apply(ReadOnlySpan<double> raw, ReadOnlySpan<double> referenceEmfV, double fixedReferenceEmfV, Span<double> si)
        {
            var emf = ThreadScratch.Rent(ScratchSlots.ThermocoupleEmf, raw.Length).AsSpan(0, raw.Length);
            var i = 0;
            if (Vector.IsHardwareAccelerated)
            {
                // (s·x + h) + E_ref, the per-sample order; NaN stays NaN for the inverse to pass through.
                var width = Vector<double>.Count;
                var scale = new Vector<double>(RawToSi.Scale);
                var shift = new Vector<double>(RawToSi.Shift);
                var fixedReference = new Vector<double>(fixedReferenceEmfV);
                for (; i <= raw.Length - width; i += width)
                {
                    var reference = referenceEmfV.IsEmpty ? fixedReference : new Vector<double>(referenceEmfV.Slice(i, width));
                    ((scale * new Vector<double>(raw.Slice(i, width))) + shift + reference).CopyTo(emf.Slice(i, width));
                }
            }
            for (; i < raw.Length; i++)
            {
                emf[i] = RawToSi.Apply(raw[i]) + (referenceEmfV.IsEmpty ? fixedReferenceEmfV : referenceEmfV[i]);
            }
            Its90Thermocouple.TemperaturesK(Type, emf, si[..raw.Length]);
        }
    }

    /// <summary>
    /// T = CVD⁻¹(s·x + h): the logged signal to ohms, then the IEC 60751 inverse, as <see cref="ChannelConversion.For"/>
    /// does it, a block at a time (the ohms are written into the output, which the inverse then overwrites).
    /// </summary>
    private sealed record RtdChain(RtdNominal Nominal, Affine RawToSi)
    {
        [MethodImpl(MethodImplOptions.AggressiveOptimization)]
        public void Apply(ReadOnlySpan<double> raw, Span<double> si)
        {
            var ohm = si[..raw.Length];
            new LinearChain(1.0, 0.0, RawToSi, Direct: true).Apply(raw, ohm);
            CallendarVanDusen.TemperaturesK(Nominal, ohm, ohm);
        }
    }
}
