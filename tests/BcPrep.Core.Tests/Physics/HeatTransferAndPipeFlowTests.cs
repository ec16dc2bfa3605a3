using BcPrep.Physics;

namespace BcPrep.Tests.Physics;

public class HeatTransferAndPipeFlowTests
{
    [Fact]
    public void Gnielinski_matches_the_ht_library_docstring()
    {
        // [CS] ht library docs: Gnielinski(Re = 1e5, Pr = 1.2, fd = 0.0185) = 254.62682749359632; relative 1e-9.
        Assert.InRange(HeatTransfer.Gnielinski(1e5, 1.2, 0.0185) / 254.62682749359632 - 1.0, -1e-9, 1e-9);
    }

    // [CC] domain reference sheet §8.3, air Pr = 0.707, printed to 3 decimals.
    [Theory]
    [InlineData(1e4, 31.732, 32.851, 29.965)]
    [InlineData(5e4, 114.993, 119.050, 104.816)]
    [InlineData(1e5, 200.215, 207.278, 179.758)]
    public void Dittus_Boelter_and_Gnielinski_Petukhov_match_the_air_table(double reynolds, double heating, double cooling, double gnielinski)
    {
        Assert.Equal(heating, HeatTransfer.DittusBoelter(reynolds, 0.707, fluidHeated: true), 3);
        Assert.Equal(cooling, HeatTransfer.DittusBoelter(reynolds, 0.707, fluidHeated: false), 3);
        Assert.Equal(gnielinski, HeatTransfer.GnielinskiSmooth(reynolds, 0.707), 3);
    }

    [Fact]
    public void Correlations_refuse_Reynolds_numbers_outside_their_range()
    {
        Assert.Throws<BcPrepDataException>(() => HeatTransfer.DittusBoelter(5000.0, 0.707, true));
        Assert.Throws<BcPrepDataException>(() => HeatTransfer.Gnielinski(2000.0, 0.707, 0.03));
    }

    [Fact]
    public void Heater_power_and_wall_heat_flux()
    {
        var power = HeatTransfer.HeaterPower(230.0, 8.0);
        Assert.Equal(1840.0, power, 12);
        Assert.Equal(1840.0 * 0.9 / (Math.PI * 0.05 * 2.0), HeatTransfer.WallHeatFlux(power, 0.1, 0.05, 2.0), 9);
        Assert.Throws<BcPrepDataException>(() => HeatTransfer.WallHeatFlux(power, 1.0, 0.05, 2.0));
    }

    [Fact]
    public void Worked_rig_case_bulk_velocity_Reynolds_and_Nusselt()
    {
        // [CC] domain reference sheet §8.5: D = 0.05, ṁ = 0.02, 300 K, 101325 Pa → U_b 8.6569, Re 27 589,
        // Nu Dittus–Boelter heating 71.46, Gnielinski 66.23 (Pr 0.707), h = 37.59 W/(m²K) with k = 0.0263.
        var rho = DryAir.Density(101325.0, 300.0);
        var mu = DryAir.Viscosity(300.0);
        var u = PipeFlow.BulkVelocity(0.02, rho, 0.05);
        var re = PipeFlow.Reynolds(rho, u, 0.05, mu);
        Assert.Equal(8.6569, u, 4);
        Assert.Equal(27589.0, re, 0);
        Assert.Equal(re, PipeFlow.ReynoldsFromMassFlow(0.02, 0.05, mu), 8);
        var nuDb = HeatTransfer.DittusBoelter(re, 0.707, true);
        Assert.Equal(71.46, nuDb, 2);
        Assert.Equal(66.23, HeatTransfer.GnielinskiSmooth(re, 0.707), 2);
        Assert.Equal(37.59, HeatTransfer.HeatTransferCoefficient(nuDb, 0.0263, 0.05), 2);
    }

    [Fact]
    public void Mach_warning_above_0p3()
    {
        var c = DryAir.SpeedOfSound(300.0);
        Assert.False(PipeFlow.IsCompressibilityWarning(PipeFlow.Mach(100.0, c)));
        Assert.True(PipeFlow.IsCompressibilityWarning(PipeFlow.Mach(110.0, c)));
    }
}
