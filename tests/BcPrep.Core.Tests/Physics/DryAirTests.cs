using BcPrep.Physics;

namespace BcPrep.Tests.Physics;

public class DryAirTests
{
    [Fact]
    public void Ideal_gas_density_at_300_K_and_one_atmosphere_matches_p_over_RT()
    {
        // [CC] domain reference sheet §7: 101325/(287.05·300) = 1.17662 kg/m³.
        Assert.Equal(1.17662, DryAir.Density(101325.0, 300.0), 5);
    }

    // Çengel, Heat and Mass Transfer, Table A-15 (air at 1 atm): ρ at 0, 20, 25, 50, 100 °C.
    // The table is printed to 4 significant digits; ideal gas with R = 287.05 agrees within 0.1 %.
    [Theory]
    [InlineData(273.15, 1.292)]
    [InlineData(293.15, 1.204)]
    [InlineData(298.15, 1.184)]
    [InlineData(323.15, 1.092)]
    [InlineData(373.15, 0.9458)]
    public void Density_matches_Cengel_A15_at_one_atmosphere_within_0p1_percent(double temperatureK, double tableKgPerM3)
    {
        Assert.InRange(DryAir.Density(101325.0, temperatureK) / tableKgPerM3 - 1.0, -1e-3, 1e-3);
    }

    // Incropera Table A.4 (from memory) densities correspond to ~100.0 kPa, not 1 atm (sheet §7 caution):
    // compared at 100 kPa within 0.1 %.
    [Theory]
    [InlineData(250.0, 1.3947)]
    [InlineData(300.0, 1.1614)]
    [InlineData(350.0, 0.9950)]
    [InlineData(400.0, 0.8711)]
    public void Density_matches_Incropera_A4_at_its_implied_100_kPa_within_0p1_percent(double temperatureK, double tableKgPerM3)
    {
        Assert.InRange(DryAir.Density(100000.0, temperatureK) / tableKgPerM3 - 1.0, -1e-3, 1e-3);
    }

    [Theory]
    [InlineData(300.0, 1.84600e-5)]
    [InlineData(250.0, 1.5991e-5)]
    [InlineData(350.0, 2.0736e-5)]
    [InlineData(400.0, 2.2853e-5)]
    [InlineData(273.15, 1.7161e-5)]
    public void Sutherland_viscosity_reproduces_the_beta_form_check_values(double temperatureK, double expectedPaS)
    {
        // [CC] domain reference sheet §7 (β_s = 1.458e-6, S = 110.4 K), printed to 5 digits.
        Assert.InRange(DryAir.Viscosity(temperatureK) / expectedPaS - 1.0, -5e-5, 5e-5);
    }

    // Incropera Table A.4 μ (from memory): within 0.7 %.
    [Theory]
    [InlineData(250.0, 159.6e-7)]
    [InlineData(300.0, 184.6e-7)]
    [InlineData(350.0, 208.2e-7)]
    [InlineData(400.0, 230.1e-7)]
    public void Viscosity_is_within_0p7_percent_of_Incropera_A4(double temperatureK, double tablePaS)
    {
        Assert.InRange(DryAir.Viscosity(temperatureK) / tablePaS - 1.0, -0.007, 0.007);
    }

    // Çengel Table A-15 μ: within 0.8 % (Sutherland is 0.75 % low at 0 °C against this table).
    [Theory]
    [InlineData(273.15, 1.729e-5)]
    [InlineData(293.15, 1.825e-5)]
    [InlineData(298.15, 1.849e-5)]
    [InlineData(323.15, 1.963e-5)]
    [InlineData(373.15, 2.181e-5)]
    public void Viscosity_is_within_0p8_percent_of_Cengel_A15(double temperatureK, double tablePaS)
    {
        Assert.InRange(DryAir.Viscosity(temperatureK) / tablePaS - 1.0, -0.008, 0.008);
    }

    [Fact]
    public void Conductivity_at_300_K_reproduces_the_White_law_check_value()
    {
        // [CC] domain reference sheet §7: k(300 K) = 0.02624 W/(m·K).
        Assert.Equal(0.02624, DryAir.ThermalConductivity(300.0), 5);
    }

    // Incropera A.4 (from memory) and Çengel A-15 k: within 3 % (the two tables differ by ~2.5 % themselves).
    [Theory]
    [InlineData(250.0, 0.0223)]
    [InlineData(300.0, 0.0263)]
    [InlineData(350.0, 0.0300)]
    [InlineData(400.0, 0.0338)]
    [InlineData(273.15, 0.02364)]
    [InlineData(293.15, 0.02514)]
    [InlineData(323.15, 0.02735)]
    [InlineData(373.15, 0.03095)]
    public void Conductivity_is_within_3_percent_of_handbook_tables(double temperatureK, double tableWPerMK)
    {
        Assert.InRange(DryAir.ThermalConductivity(temperatureK) / tableWPerMK - 1.0, -0.03, 0.03);
    }

    // Incropera Table A.4 cp 250–600 K (from memory; 450–600 K rows not in the sheet) and Çengel A-15 cp:
    // within 0.5 % (the model is the zero-pressure cp; 1-atm tables sit 0.2–0.4 % higher near room temperature).
    [Theory]
    [InlineData(250.0, 1006.0)]
    [InlineData(300.0, 1007.0)]
    [InlineData(350.0, 1009.0)]
    [InlineData(400.0, 1014.0)]
    [InlineData(450.0, 1021.0)]
    [InlineData(500.0, 1030.0)]
    [InlineData(550.0, 1040.0)]
    [InlineData(600.0, 1051.0)]
    [InlineData(273.15, 1006.0)]
    [InlineData(293.15, 1007.0)]
    [InlineData(373.15, 1009.0)]
    public void Cp_is_within_0p5_percent_of_handbook_tables(double temperatureK, double tableJPerKgK)
    {
        Assert.InRange(DryAir.SpecificHeatCp(temperatureK) / tableJPerKgK - 1.0, -0.005, 0.005);
    }

    [Fact]
    public void Cp_tends_to_the_calorically_perfect_value_when_vibration_is_frozen()
    {
        // At 200 K vibration contributes < 0.1 %: cp → 7/2 R (diatomic) mixed with 5/2 R (argon) ≈ 1002.0 J/(kg·K).
        var frozen = ((0.99030 * 3.5) + (0.00934 * 2.5)) / 0.99964 * 287.05;
        Assert.InRange(DryAir.SpecificHeatCp(200.0) / frozen - 1.0, 0.0, 1e-3);
    }

    [Theory]
    [InlineData(250.0, 0.720)]
    [InlineData(300.0, 0.707)]
    [InlineData(350.0, 0.700)]
    [InlineData(400.0, 0.690)]
    public void Prandtl_is_within_1_percent_of_Incropera_A4(double temperatureK, double tablePr)
    {
        // Incropera Table A.4 (from memory); μ, k, cp errors partly cancel.
        Assert.InRange(DryAir.Prandtl(temperatureK) / tablePr - 1.0, -0.01, 0.01);
    }

    [Fact]
    public void Speed_of_sound_at_288_15_K_is_the_standard_atmosphere_sea_level_value()
    {
        // US Standard Atmosphere 1976 sea level a0 = 340.294 m/s (from memory); √(1.4·287.05·288.15) = 340.29.
        Assert.Equal(340.29, DryAir.SpeedOfSound(288.15), 2);
    }

    [Theory]
    [InlineData(150.0)]
    [InlineData(1200.0)]
    [InlineData(double.NaN)]
    public void Cp_outside_its_range_throws(double temperatureK)
    {
        Assert.Throws<BcPrepDataException>(() => DryAir.SpecificHeatCp(temperatureK));
    }

    [Fact]
    public void Density_rejects_pressure_outside_range_and_speed_of_sound_rejects_hot_gas()
    {
        Assert.Throws<BcPrepDataException>(() => DryAir.Density(5.0e5, 300.0));
        Assert.Throws<BcPrepDataException>(() => DryAir.SpeedOfSound(700.0));
        Assert.Throws<BcPrepDataException>(() => DryAir.Viscosity(100.0));
        Assert.Throws<BcPrepDataException>(() => DryAir.ThermalConductivity(1500.0));
    }
}
