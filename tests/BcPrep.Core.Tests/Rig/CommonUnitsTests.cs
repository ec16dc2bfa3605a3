using System.Globalization;
using BcPrep.Rig;
using UnitsNet;

namespace BcPrep.Tests.Rig;

/// <summary>
/// The units converted without UnitsNet give UnitsNet's numbers bit for bit: each listed unit, parsed by UnitsNet from the
/// same text and converted to the same SI unit, over values of every magnitude and sign. (UnitsNet is the reference here;
/// its factors themselves are checked against NIST SP 811 in <see cref="UnitTextTests"/>.)
/// </summary>
public class CommonUnitsTests
{
    public static TheoryData<Dimension, string> Listed()
    {
        var data = new TheoryData<Dimension, string>();
        foreach (var (dimension, unit) in CommonUnits.Listed)
        {
            data.Add(dimension, unit);
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Listed))]
    public void A_listed_unit_converts_as_UnitsNet_does_bit_for_bit(Dimension dimension, string unit)
    {
        var (quantityType, siUnit) = UnitText.Target(dimension);
        foreach (var value in Values())
        {
            var text = value.ToString("R", CultureInfo.InvariantCulture) + " " + unit;
            Assert.True(Quantity.TryParse(CultureInfo.InvariantCulture, quantityType, text, out var quantity), $"UnitsNet does not read '{text}'");
            Assert.True(CommonUnits.TryToSi(value, unit, dimension, out var fast));
            var reference = quantity.As(siUnit);
            Assert.True(BitConverter.DoubleToInt64Bits(reference) == BitConverter.DoubleToInt64Bits(fast),
                $"'{text}': UnitsNet {reference:R}, listed {fast:R}");
        }
    }

    [Fact]
    public void A_unit_listed_for_another_dimension_only_is_one_UnitsNet_refuses_for_this_one()
    {
        Dimension[] dimensions = [Dimension.Length, Dimension.Pressure, Dimension.Temperature, Dimension.Voltage, Dimension.Current,
            Dimension.Resistance, Dimension.MassFlow, Dimension.Duration, Dimension.Frequency, Dimension.Power];
        var pairs = 0;
        foreach (var unit in CommonUnits.Listed.Select(l => l.Unit).Distinct())
        {
            foreach (var dimension in dimensions.Where(d => CommonUnits.BelongsElsewhere(unit, d)))
            {
                pairs++;
                Assert.False(Quantity.TryParse(CultureInfo.InvariantCulture, UnitText.Target(dimension).QuantityType, "1 " + unit, out _),
                    $"UnitsNet reads '1 {unit}' as {dimension}");
                Assert.False(UnitText.TryToSi("1 " + unit, dimension, out _, out var error));
                Assert.Contains($"'{unit}' in '1 {unit}' is not a unit of", error);
            }
        }
        Assert.True(pairs > 100, $"only {pairs} pairs checked");
        foreach (var (dimension, unit) in CommonUnits.ReadElsewhereToo)
        {
            // The exceptions are real: UnitsNet reads them (Ångström, petaampere, hand, minute), so they must reach it.
            Assert.True(Quantity.TryParse(CultureInfo.InvariantCulture, UnitText.Target(dimension).QuantityType, "1 " + unit, out _), $"({dimension}, {unit})");
            Assert.False(CommonUnits.BelongsElsewhere(unit, dimension));
        }
        Assert.False(CommonUnits.BelongsElsewhere("mA", Dimension.Current));
        Assert.True(CommonUnits.BelongsElsewhere("mA", Dimension.Voltage));
        Assert.False(CommonUnits.BelongsElsewhere("inH2O", Dimension.Voltage)); // not listed at all: UnitsNet decides
    }

    [Fact]
    public void Typed_spellings_reach_the_listed_units_and_others_still_go_to_UnitsNet()
    {
        // degC, um and ohm are the aliases people type; inH2O is not listed and still converts (through UnitsNet).
        Assert.True(UnitText.TryToSi("20 degC", Dimension.Temperature, out var kelvin, out _));
        Assert.Equal(20 + 273.15, kelvin);
        Assert.True(UnitText.TryToSi("1.5 um", Dimension.Length, out var metres, out _));
        Assert.Equal(1.5 * 1e-6, metres);
        Assert.True(UnitText.TryToSi("4 inH2O", Dimension.Pressure, out var pascals, out _));
        Assert.Equal(4 * 249.0889, pascals, 0.001); // NIST SP 811, inch of water (conventional), from memory
        Assert.False(CommonUnits.TryToSi(4, "inH2O", Dimension.Pressure, out _));
    }

    /// <summary>Random values over 40 decades of both signs, and round ones.</summary>
    private static IEnumerable<double> Values()
    {
        var random = new Random(19);
        for (var i = 0; i < 2000; i++)
        {
            var magnitude = Math.Pow(10, (random.NextDouble() * 40) - 20) * (1 + random.NextDouble());
            yield return random.Next(2) == 0 ? magnitude : -magnitude;
        }
        foreach (var round in new[] { 0.0, 1.0, 0.1, 0.3, 52.5, 1.5, 0.05, 0.0004, 20, 97, 101325, 1e-9, 123456789.123 })
        {
            yield return round;
        }
    }
}
