using BcPrep.Physics;

namespace BcPrep.Tests.Physics;

public class MoistAirMixtureTests
{
    [Fact]
    public void Dry_air_keeps_its_cp()
    {
        Assert.Equal(1006.0, MoistAirMixture.SpecificHeatCp(1006.0, 0.0));
    }

    [Fact]
    public void Mass_weighted_cp_at_one_percent_vapour()
    {
        // Hand calculation with M_v = 18.01528 g/mol and M_a = 28.96546 g/mol (CIPM-2007 molar masses):
        // y = 0.01·18.01528 / (0.01·18.01528 + 0.99·28.96546) = 0.0062431; cp = (1 − y)·1006 + y·1872 = 1011.4065.
        Assert.Equal(0.0062431, MoistAirMixture.VapourMassFraction(0.01), 1e-7);
        Assert.Equal(1011.4065, MoistAirMixture.SpecificHeatCp(1006.0, 0.01), 1e-3);
    }

    [Fact]
    public void Mole_fraction_outside_0_1_is_rejected()
    {
        Assert.Throws<BcPrepDataException>(() => MoistAirMixture.VapourMassFraction(1.5));
    }
}
