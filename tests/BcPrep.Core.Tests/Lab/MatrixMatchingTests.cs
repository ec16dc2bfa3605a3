using BcPrep.Lab;
using BcPrep.Rig;

namespace BcPrep.Tests.Lab;

public class MatrixMatchingTests
{
    private static readonly TestMatrix Plan = new("plan.csv",
        [new PlannedQuantity("mass_flow", Dimension.MassFlow), new PlannedQuantity("heater_power", Dimension.Power)],
        [
            Row("low", 4, (0.020, 0.001), (600, 30)),
            Row("mid", 5, (0.030, 0.001), (900, 45)),
            Row("high", 6, (0.040, 0.001), (1200, 60)),
        ]);

    private static MatrixRow Row(string name, int line, (double Flow, double Tol) flow, (double Power, double Tol) power) =>
        new(name, [new SetPoint("mass_flow", flow.Flow, flow.Tol), new SetPoint("heater_power", power.Power, power.Tol)], new SourceLocation("plan.csv", line, 1, name));

    private static MeasuredPoint Point(string id, double flow, double power) =>
        new(id, q => q switch { "mass_flow" => flow, "heater_power" => power, _ => null });

    [Fact]
    public void Points_within_tolerance_take_the_row_names()
    {
        var report = MatrixMatching.Match(Plan, [Point("OP1", 0.0205, 590), Point("OP2", 0.0299, 930)]);
        Assert.Equal("low", report.NewIdOf("OP1"));
        Assert.Equal("mid", report.NewIdOf("OP2"));
        var deviation = report.Matches[0].Deviations.Single(d => d.Quantity == "heater_power");
        Assert.Equal(590.0, deviation.MeasuredSi);
        Assert.Equal(600.0, deviation.PlannedSi);
        // 'high' was planned but not run.
        Assert.Equal("high", Assert.Single(report.RowsWithoutPoint).Name);
        Assert.Contains(report.Warnings, w => w.Contains("'high'", StringComparison.Ordinal) && w.Contains("no operating point", StringComparison.Ordinal));
    }

    [Fact]
    public void Point_outside_every_tolerance_keeps_its_id_and_is_reported_with_the_nearest_row()
    {
        var report = MatrixMatching.Match(Plan, [Point("OP1", 0.0212, 600), Point("OP2", 0.030, 900)]);
        Assert.Equal(["OP1"], report.UnmatchedPoints);
        Assert.Equal("OP1", report.NewIdOf("OP1"));
        var warning = Assert.Single(report.Warnings, w => w.Contains("'OP1'", StringComparison.Ordinal));
        Assert.Contains("nearest 'low'", warning, StringComparison.Ordinal);
        Assert.Contains("off by 1.2 tolerances", warning, StringComparison.Ordinal); // |0.0212-0.020|/0.001
    }

    [Fact]
    public void Values_in_the_nearest_row_message_are_written_for_a_person_never_in_e_notation()
    {
        // MeasurementText (common practice): four significant digits, a power of ten beyond six decimals, never "E-05";
        // five-digit integers grouped by U+202F (SI Brochure 5.4.4).
        var plan = Plan with { Rows = [Row("tiny", 8, (0.00002, 0.000001), (12000, 30))] };

        var report = MatrixMatching.Match(plan, [Point("OP1", 0.0000215, 12345.67)]);

        var warning = Assert.Single(report.Warnings, w => w.Contains("'OP1'", StringComparison.Ordinal));
        Assert.Contains("mass_flow = 2.15 × 10⁻⁵ (planned 2 × 10⁻⁵ ± 1 × 10⁻⁶)", warning, StringComparison.Ordinal);
        Assert.Contains("heater_power = 12\u202F350 (planned 12\u202F000 ± 30)", warning, StringComparison.Ordinal);
        Assert.DoesNotContain("E-", warning, StringComparison.Ordinal);
    }

    [Fact]
    public void Edge_of_the_tolerance_band_still_matches()
    {
        var report = MatrixMatching.Match(Plan, [Point("OP1", 0.020, 630)]);
        Assert.Equal("low", report.NewIdOf("OP1"));
    }

    [Fact]
    public void Repeat_of_a_planned_point_is_numbered()
    {
        var report = MatrixMatching.Match(Plan, [Point("OP1", 0.020, 600), Point("OP2", 0.030, 900), Point("OP3", 0.0201, 601)]);
        Assert.Equal(["low", "mid", "low-2"], new[] { "OP1", "OP2", "OP3" }.Select(report.NewIdOf));
        Assert.Contains(report.Warnings, w => w.Contains("repeats planned point 'low'", StringComparison.Ordinal));
    }

    [Fact]
    public void Point_inside_two_overlapping_rows_is_an_error_naming_both_lines()
    {
        var overlapping = Plan with { Rows = [.. Plan.Rows, Row("low-bis", 7, (0.0205, 0.001), (600, 60))] };
        var failure = Assert.Throws<BcPrepFailure>(() => MatrixMatching.Match(overlapping, [Point("OP1", 0.0202, 600)]));
        Assert.Equal(FailureKind.Configuration, failure.Kind);
        var message = Assert.Single(failure.Problems).Message;
        Assert.Contains("'low' (line 4)", message, StringComparison.Ordinal);
        Assert.Contains("'low-bis' (line 7)", message, StringComparison.Ordinal);
    }

    [Fact]
    public void Quantity_a_point_did_not_measure_never_matches()
    {
        var report = MatrixMatching.Match(Plan, [new MeasuredPoint("OP1", q => q == "mass_flow" ? 0.020 : null)]);
        Assert.Equal(["OP1"], report.UnmatchedPoints);
    }
}
