using BcPrep.Lab;
using BcPrep.Rig;

namespace BcPrep.Tests.Lab;

public class TestMatrixReaderTests
{
    private static RigDescription Rig() =>
        RigLoader.Load(File.ReadAllText(Path.Combine(RepoRoot.Path, "sample-logs", "marten-rig.toml")), "marten-rig.toml");

    private static TestMatrix Parse(string text) => TestMatrixReader.Parse(text, "plan.csv", Rig());

    [Fact]
    public void Sample_matrix_converts_header_units_to_SI()
    {
        var path = Path.Combine(RepoRoot.Path, "sample-logs", "plans", "marten-matrix.csv");
        var matrix = TestMatrixReader.Parse(File.ReadAllText(path), "marten-matrix.csv", Rig());
        Assert.Equal(["F20-H600", "F30-H900", "F40-H1200"], matrix.Rows.Select(r => r.Name));
        var flow = matrix.Rows[0].SetPoints.Single(s => s.Quantity == "mass_flow");
        Assert.Equal(72.0 / 3600, flow.PlannedSi, 1e-15);   // kg/h -> kg/s
        Assert.Equal(4.0 / 3600, flow.ToleranceSi, 1e-15);
        var power = matrix.Rows[0].SetPoints.Single(s => s.Quantity == "heater_power");
        Assert.Equal(600.0, power.PlannedSi, 1e-9);          // kW -> W
        Assert.Equal(30.0, power.ToleranceSi, 1e-9);         // 5 % of the planned value
        Assert.Equal(4, matrix.Rows[0].Location.Line);
    }

    [Fact]
    public void Temperatures_in_degF_and_cell_units_follow_NIST_SP811()
    {
        var matrix = Parse("point,inlet.temperature [degF],tolerance_inlet.temperature [degF],mass_flow [kg/s],tolerance_mass_flow [kg/s]\n" +
                           "A,150,9,,\n" +
                           "B,20 degC,0.5 K,100 lb/h,1 %\n");
        var a = Assert.Single(matrix.Rows[0].SetPoints);
        Assert.Equal((150 + 459.67) / 1.8, a.PlannedSi, 1e-9); // T/K = (t/°F + 459.67)/1.8, exact (NIST SP 811 B.8)
        Assert.Equal(5.0, a.ToleranceSi, 1e-12);                // a difference of 9 °F is 5 K
        var b = matrix.Rows[1].SetPoints;
        Assert.Equal(293.15, b[0].PlannedSi, 1e-12);
        Assert.Equal(100 * 0.45359237 / 3600, b[1].PlannedSi, 1e-8); // avoirdupois pound, exact; UnitsNet lb/h to 1.8e-7
        Assert.Equal(0.01 * b[1].PlannedSi, b[1].ToleranceSi, 1e-15);
    }

    [Fact]
    public void Channel_ids_can_be_planned_by_their_window_mean()
    {
        var matrix = Parse("point,heater_v [V],tolerance_heater_v [V]\nlow,150,5\n");
        Assert.Equal(150.0, Assert.Single(matrix.Rows[0].SetPoints).PlannedSi, 1e-12);
    }

    [Theory]
    [InlineData("point,mass_flw [kg/s],tolerance_mass_flw [kg/s]\nA,0.02,0.001\n", 1, 7, "did you mean 'mass_flow'")]
    [InlineData("point,heater_power [kg/s],tolerance_heater_power [W]\nA,600,30\n", 1, 7, "'kg/s' in '1 kg/s' is not a unit of power")]
    [InlineData("point,mass_flow [kg/s]\nA,0.02\n", 1, 7, "has no tolerance column")]
    [InlineData("point,mass_flow [kg/s],tolerance_mass_flow [kg/s]\nA,0.02,0.001\nB,fast,0.001\n", 3, 3, "does not start with a number")]
    [InlineData("point,mass_flow [kg/s],tolerance_mass_flow [kg/s]\nA,0.02,0.001\nA,0.03,0.001\n", 3, 1, "used twice")]
    [InlineData("point,mass_flow [kg/s],tolerance_mass_flow [kg/s]\nA,0.02,\n", 2, 3, "no tolerance")]
    [InlineData("point,mass_flow [kg/s],tolerance_mass_flow [kg/s]\nA,0.02,0.001,9\n", 2, 14, "fields")]
    [InlineData("point,inlet.temperature [degC],tolerance_inlet.temperature [%]\nA,20,1\n", 2, 6, "temperature scale")]
    [InlineData("mass_flow [kg/s],tolerance_mass_flow [kg/s]\n0.02,0.001\n", 1, 1, "no 'point' column")]
    public void Bad_matrix_is_reported_with_file_line_and_column(string text, int line, int column, string fragment)
    {
        var failure = Assert.Throws<BcPrepFailure>(() => Parse(text));
        Assert.Equal(FailureKind.Configuration, failure.Kind);
        var problem = Assert.Single(failure.Problems, p => p.Message.Contains(fragment, StringComparison.Ordinal));
        Assert.Equal("plan.csv", problem.Location.File);
        Assert.Equal(line, problem.Location.Line);
        Assert.Equal(column, problem.Location.Column);
    }
}
