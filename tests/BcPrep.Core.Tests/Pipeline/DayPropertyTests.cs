using BcPrep.Pipeline;
using BcPrep.Rig;
using CsCheck;

namespace BcPrep.Tests.Pipeline;

/// <summary>
/// End-to-end invariances of DayProcessor on small generated days (GeneratedDay). No external source: these are
/// properties any correct reduction must have. Iteration counts are small because each run propagates the whole
/// point model; the profile's mass-flow integral is a property of its own, in
/// Profiles/VelocityProfileTests.Every_model_reproduces_the_mass_flow_and_its_raw_grid_error_stays_below_0p1_percent.
/// </summary>
public class DayPropertyTests
{
    private const long Iterations = 4;
    private static readonly ProcessOptions Options = new();

    [Fact]
    public void Permuting_the_log_files_changes_nothing()
    {
        var rig = GeneratedDay.Rig(20.5, 230.5);
        Gen.Select(Gen.Int[0, 5], Gen.Int[0, int.MaxValue]).Sample(
            (permutation, seed) =>
            {
                using var day = new GeneratedDay(seed);
                var files = new[] { day.Write("a.csv", 0, 80), day.Write("b.csv", 80, 160), day.Write("c.csv", 160, GeneratedDay.Rows) };
                int[][] orders = [[0, 1, 2], [0, 2, 1], [1, 0, 2], [1, 2, 0], [2, 0, 1], [2, 1, 0]];
                var inOrder = DayProcessor.Process(rig, files, Options).Points.Single();
                var shuffled = DayProcessor.Process(rig, orders[permutation].Select(i => files[i]).ToList(), Options).Points.Single();
                for (var i = 0; i < inOrder.Gum.Outputs.Count; i++)
                {
                    Assert.Equal(inOrder.Gum.Outputs[i].Estimate, shuffled.Gum.Outputs[i].Estimate);
                    Assert.Equal(inOrder.Gum.Outputs[i].StandardUncertainty, shuffled.Gum.Outputs[i].StandardUncertainty);
                }
            },
            iter: Iterations,
            threads: 1);
    }

    [Fact]
    public void Adding_a_constant_to_a_gauge_pressure_shifts_the_outlet_pressure_by_that_constant_without_tare()
    {
        // The rig's outlet transducer is linear, 500 Pa/V, gauge relative to the barometer: c/500 V on the raw
        // column is +c Pa on the absolute outlet pressure; the inlet channel is untouched.
        var rig = GeneratedDay.Rig(20.5, 230.5);
        var gain = ((LinearSensor)rig.Channel("p_out")!.Sensor).Gain;
        Gen.Select(Gen.Double[-1500.0, 1500.0], Gen.Int[0, int.MaxValue]).Sample(
            (shiftPa, seed) =>
            {
                using var day = new GeneratedDay(seed);
                var before = DayProcessor.Process(rig, [day.Write("day.csv")], Options).Points.Single();
                var shifted = day.Write("shifted.csv", raw: (c, v) => GeneratedDay.Columns[c] == "PT_OUT_V" ? v + (shiftPa / gain) : v);
                var after = DayProcessor.Process(rig, [shifted], Options).Points.Single();
                Assert.Equal(before.Output("outlet.static_pressure")!.Estimate + shiftPa, after.Output("outlet.static_pressure")!.Estimate, 1e-6);
                Assert.Equal(before.Output("inlet.static_pressure")!.Estimate, after.Output("inlet.static_pressure")!.Estimate);
            },
            iter: Iterations,
            threads: 1);
    }

    [Fact]
    public void With_a_fan_off_tare_a_constant_added_to_a_gauge_pressure_cancels()
    {
        // With tare = the channel's mean over the fan-off rows, the same constant is in the tare and in the window:
        // the outlet pressure must not move (to rounding).
        var rig = GeneratedDay.Rig(30.5, 230.5, tare: "from = \"0 s\", to = \"15 s\"");
        var gain = ((LinearSensor)rig.Channel("p_out")!.Sensor).Gain;
        Gen.Select(Gen.Double[-1500.0, 1500.0], Gen.Int[0, int.MaxValue]).Sample(
            (shiftPa, seed) =>
            {
                using var day = new GeneratedDay(seed, fanOffStart: true);
                var before = DayProcessor.Process(rig, [day.Write("day.csv")], Options).Points.Single();
                var shifted = day.Write("shifted.csv", raw: (c, v) => GeneratedDay.Columns[c] == "PT_OUT_V" ? v + (shiftPa / gain) : v);
                var after = DayProcessor.Process(rig, [shifted], Options).Points.Single();
                Assert.Equal(before.Output("outlet.static_pressure")!.Estimate, after.Output("outlet.static_pressure")!.Estimate, 1e-6);
            },
            iter: Iterations,
            threads: 1);
    }

    [Fact]
    public void Scaling_time_and_the_window_by_a_constant_leaves_the_window_means_unchanged()
    {
        // Window edges fall half-way between samples, so scaling cannot move a sample across an edge.
        Gen.Select(Gen.Double[0.25, 8.0], Gen.Int[0, int.MaxValue]).Sample(
            (scale, seed) =>
            {
                using var day = new GeneratedDay(seed);
                var original = DayProcessor.Process(GeneratedDay.Rig(20.5, 230.5), [day.Write("day.csv")], Options).Points.Single();
                var scaledRig = GeneratedDay.Rig(20.5 * scale, 230.5 * scale);
                var scaled = DayProcessor.Process(scaledRig, [day.Write("scaled.csv", time: t => t * scale)], Options).Points.Single();
                Assert.Equal(original.Channels.Count, scaled.Channels.Count);
                foreach (var (channel, stats) in original.Channels)
                {
                    Assert.Equal(stats.SampleCount, scaled.Channels[channel].SampleCount);
                    Assert.Equal(stats.Mean, scaled.Channels[channel].Mean, Math.Abs(stats.Mean) * 1e-12);
                }
            },
            iter: Iterations,
            threads: 1);
    }
}
