namespace BcPrep.Tests.Pipeline;

/// <summary>
/// Tares at the start and the end of the day (common practice: the fan is off at both ends): the zero is interpolated
/// linearly in time to each point, and a drift beyond the declared zero uncertainty is a warning.
/// </summary>
public class EndTareTests
{
    // A flow meter whose zero drifts by 2e-6 kg/s per second (1.2e-3 kg/s over the 600 s day, 2.4 % of the flow);
    // the flow is 0.05 kg/s inside the point's window (20–580 s) and 0 in the no-flow tares at 0–15 s and 585–599 s.
    private static double MeterReading(double t) => (t is >= 20 and <= 580 ? 0.05 : 0.0) + (2e-6 * t);

    private static SyntheticDay Day(string endTare, string uncertainty) => BoundaryPhysicsTests.Duct()
        .Channel("m_dot", SyntheticDay.Direct("mass_flow", "kg/s", "tare = { from = \"0 s\", to = \"15 s\" }\n" + endTare), MeterReading, 1e-6, uncertainty);

    [Fact]
    public void Zero_interpolated_between_start_and_end_tares_removes_a_linear_drift()
    {
        // Start tare alone: 0.05 + 2e-6·(300 − 7) ≈ 0.050586 kg/s. Interpolated zero at the point's mid-time (300 s)
        // between the tares' mid-times (7 s, 592 s): the drift cancels, 0.05 kg/s.
        using var startOnly = Day("", "{ kind = \"absolute\", value = \"0.0002 kg/s\", source = \"test\" }");
        Assert.Equal(0.05 + (2e-6 * 293), startOnly.Process().Points.Single().Output("mass_flow")!.Estimate, 2e-5);

        using var both = Day("tare_end = { from = \"585 s\", to = \"599 s\" }", "{ kind = \"absolute\", value = \"0.0002 kg/s\", source = \"test\" }");
        var point = both.Process().Points.Single();
        Assert.Equal(0.05, point.Output("mass_flow")!.Estimate, 2e-5);
        // The end tare is an input of the budget, weighted by the point's place between the tares (about one half).
        var end = point.Output("mass_flow")!.Budget.Single(b => b.InputName == "m_dot end-of-day tare mean");
        Assert.Equal(-0.5, end.SensitivityCoefficient, 0.01);
        // Drift 1.17e-3 kg/s against the declared absolute term 2e-4/√3 kg/s: a warning naming the channel.
        Assert.Contains(point.Warnings, w => w.Contains("'m_dot'", StringComparison.Ordinal) && w.Contains("zero drifted", StringComparison.Ordinal));
    }

    [Fact]
    public void Drift_within_the_declared_zero_uncertainty_draws_no_warning()
    {
        using var day = Day("tare_end = { from = \"585 s\", to = \"599 s\", zero_uncertainty = \"0.002 kg/s\" }", "");
        var point = day.Process().Points.Single();
        Assert.DoesNotContain(point.Warnings, w => w.Contains("zero drifted", StringComparison.Ordinal));
    }
}
