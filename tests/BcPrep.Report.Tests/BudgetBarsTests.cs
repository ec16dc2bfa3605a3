using BcPrep.Pipeline;
using BcPrep.Report;

namespace BcPrep.Tests.Report;

/// <summary>
/// The budget bars are the GUM variance shares. JCGM 100 5.1.2 eq. (10): u_c² = Σ cᵢ²u²(xᵢ) for independent inputs,
/// and 5.2.2 eq. (13) adds the covariance terms, so the inputs' shares plus the correlations' share add up to 1.
/// </summary>
public sealed class BudgetBarsTests
{
    [Theory]
    [InlineData("mass_flow")]
    [InlineData("inlet.temperature")]
    [InlineData("wall.heat_flux")]
    public void Bars_are_the_largest_variance_shares_in_order_and_add_up_to_100_percent(string quantity)
    {
        var point = SampleDays.Day.Points[0];
        var output = point.Output(quantity)!;

        var bars = BudgetFigure.Bars(point, PointOutputs.Scalars.Single(s => s.Name == quantity));

        var named = bars.Where(b => !b.Label.StartsWith("other", StringComparison.Ordinal) && b.Label != "input correlations").ToList();
        Assert.InRange(named.Count, 1, BudgetFigure.TopContributors);
        Assert.Equal(named.Select(b => b.SharePercent).OrderByDescending(s => s), named.Select(b => b.SharePercent));
        var largest = output.Budget.MaxBy(b => b.VarianceShare)!;
        Assert.Equal(largest.InputName, named[0].Label);
        Assert.Equal(100.0 * largest.VarianceShare, named[0].SharePercent, 12);
        // Every input is kept, named or summed into "other"; a correlation share below 1e-6 is left out, hence 1e-3 %.
        Assert.InRange(bars.Sum(b => b.SharePercent), 100.0 - 1e-3, 100.0 + 1e-3);
    }

    [Fact]
    public void Inlet_temperature_budget_is_led_by_the_thermocouple_class_term()
    {
        // README (budget command): on the sample day the IEC 60584-1 class 1 term holds about 98 % of the variance.
        var bars = BudgetFigure.Bars(SampleDays.Day.Points[0], PointOutputs.InletTemperature);

        Assert.InRange(bars[0].SharePercent, 95.0, 99.5);
    }

    [Fact]
    public void A_quantity_the_point_lacks_gives_no_bars_and_no_figure()
    {
        var point = SampleDays.Day.Points[0];
        var absent = new ScalarOutput("no.such.quantity", "1", "an output no point model defines", (_, _) => 0.0);

        Assert.Empty(BudgetFigure.Bars(point, absent));
        Assert.Null(BudgetFigure.Render(point, absent, "x.png"));
    }
}
