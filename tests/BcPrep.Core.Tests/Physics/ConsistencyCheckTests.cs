using BcPrep.Physics;

namespace BcPrep.Tests.Physics;

public class ConsistencyCheckTests
{
    [Fact]
    public void Energy_balance_reports_relative_mismatch_and_verdict()
    {
        // 1000 W heater, 5 % loss → 950 W; ṁ cp ΔT = 0.02 · 1007 · 46 = 926.44 W → mismatch −2.48 %.
        var pass = ConsistencyCheck.EnergyBalance(1000.0, 0.05, 0.02, 1007.0, 300.0, 346.0, 0.03);
        Assert.Equal(950.0, pass.Reference, 9);
        Assert.Equal(926.44, pass.Compared, 9);
        Assert.Equal((926.44 - 950.0) / 950.0, pass.RelativeMismatch, 12);
        Assert.Equal(ConsistencyVerdict.Pass, pass.Verdict);
        Assert.Equal(ConsistencyVerdict.Warn, ConsistencyCheck.EnergyBalance(1000.0, 0.05, 0.02, 1007.0, 300.0, 346.0, 0.02).Verdict);
    }

    [Fact]
    public void Pressure_drop_against_Darcy_Weisbach_with_the_worked_case()
    {
        // [CC] domain reference sheet §8.5: f = 0.023952 (Colebrook smooth), ρ 1.17662, U 8.6569, D 0.05 → dp/dx 21.12 Pa/m.
        var r = ConsistencyCheck.PressureDrop(42.0, 0.023952, 2.0, 0.05, 1.17662, 8.6569, 0.05, 0.02);
        Assert.Equal(2.0 * 21.12, r.Reference, 1);
        Assert.Equal(Math.Sqrt((0.05 * 0.05) + (0.02 * 0.02)), r.RelativeTolerance, 12);
        Assert.Equal(ConsistencyVerdict.Pass, r.Verdict);
        Assert.Equal(ConsistencyVerdict.Warn, ConsistencyCheck.PressureDrop(50.0, 0.023952, 2.0, 0.05, 1.17662, 8.6569, 0.05, 0.02).Verdict);
    }
}
