using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class SensorFaultsTests
{
    private static double[] Noise(int n, int seed, double mean, double sd)
    {
        var rng = new Random(seed);
        return Enumerable.Range(0, n).Select(_ => mean + (sd * ((rng.NextDouble() * 2) - 1))).ToArray();
    }

    [Fact]
    public void Healthy_noisy_window_raises_nothing()
    {
        var x = Noise(1000, 1, 25.0, 0.2);
        var r = SensorFaults.Check(x, new SensorFaultLimits(Resolution: 0.01, PlausibleMin: -50, PlausibleMax: 500));
        Assert.False(r.HasFault);
    }

    [Fact]
    public void Clipped_signal_is_flagged_at_its_own_maximum()
    {
        var x = Noise(1000, 2, 9.0, 2.0).Select(v => Math.Min(v, 10.0)).ToArray();
        var r = SensorFaults.Check(x, new SensorFaultLimits(Resolution: 0.001));
        var flag = Assert.Single(r.Flags);
        Assert.Equal(SensorFaultKind.Saturation, flag.Kind);
        Assert.Equal(10.0, flag.EvidenceValue);
        Assert.InRange(flag.Fraction, 0.2, 0.3); // uniform on [7, 11] clipped at 10: 25 %
    }

    [Fact]
    public void Declared_rail_with_tolerance_is_used()
    {
        var x = Noise(200, 3, 4.5, 0.3).Concat(Enumerable.Repeat(4.9995, 20)).ToArray();
        var r = SensorFaults.Check(x, new SensorFaultLimits(RailHigh: 5.0, RailTolerance: 0.001));
        Assert.Contains(r.Flags, f => f.Kind == SensorFaultKind.Saturation && f.SampleCount == 20);
    }

    [Fact]
    public void Stuck_channel_is_flagged_and_not_called_saturated()
    {
        var x = Enumerable.Repeat(21.37, 500).ToArray();
        var r = SensorFaults.Check(x, new SensorFaultLimits(Resolution: 0.01));
        var flag = Assert.Single(r.Flags);
        Assert.Equal(SensorFaultKind.Stuck, flag.Kind);
        Assert.Equal(0.0, flag.EvidenceValue);
    }

    [Fact]
    public void Open_thermocouple_reading_is_implausible()
    {
        var x = Noise(100, 4, 80.0, 0.5);
        x[40] = 1372.0 + 500.0;
        x[41] = 1372.0 + 600.0;
        var r = SensorFaults.Check(x, new SensorFaultLimits(PlausibleMin: -40, PlausibleMax: 600, RailFractionThreshold: 0.5));
        var flag = Assert.Single(r.Flags);
        Assert.Equal(SensorFaultKind.Implausible, flag.Kind);
        Assert.Equal(2, flag.SampleCount);
        Assert.Equal(40, flag.FirstIndex);
        Assert.Equal(1972.0, flag.EvidenceValue);
    }

    [Fact]
    public void Nan_samples_are_counted()
    {
        double[] x = [1.0, double.NaN, 1.2, 0.9, double.PositiveInfinity, 1.1];
        var r = SensorFaults.Check(x, new SensorFaultLimits(RailFractionThreshold: 0.9));
        var flag = Assert.Single(r.Flags);
        Assert.Equal(SensorFaultKind.NonFinite, flag.Kind);
        Assert.Equal(2, flag.SampleCount);
        Assert.Equal(1, flag.FirstIndex);
    }
}
