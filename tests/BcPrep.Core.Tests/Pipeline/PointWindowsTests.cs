using BcPrep.Pipeline;
using BcPrep.Steady;
using BcPrep.Values;

namespace BcPrep.Tests.Pipeline;

public class PointWindowsTests
{
    private const double DayStartS = 1000.0;
    private static readonly DayStart Start = new(new LoggerSeconds(DayStartS));

    private static SteadyWindow Detected(double startS, double endS) =>
        new(startS, endS, startS - 600, endS, SteadyMethod.DriftScatter, []);

    private static SteadyDetectionResult Detection(params SteadyWindow[] windows) => new(windows, []);

    [Fact]
    public void Without_pinned_windows_detected_ones_become_OP1_OP2_in_time_order_on_the_log_clock()
    {
        var plan = PointWindows.Plan([], Detection(Detected(4000, 4300), Detected(1000, 1300)), Start);

        Assert.Equal(["OP1", "OP2"], plan.Points.Select(p => p.Window.Id));
        Assert.Equal(2000.0, plan.Points[0].Window.StartS);
        Assert.Equal(5300.0, plan.Points[1].Window.EndS);
        Assert.All(plan.Points, p => Assert.Equal(WindowOrigin.Detected, p.Origin));
    }

    [Fact]
    public void A_pinned_window_replaces_the_detected_window_it_overlaps_and_keeps_its_id()
    {
        // Pinned "warm" over 3900–4200 s since the day's start overlaps the second detected window only.
        var pinned = new TimeWindow("warm", DayStartS + 3900, DayStartS + 4200);
        var plan = PointWindows.Plan([pinned], Detection(Detected(1000, 1300), Detected(4000, 4300), Detected(7000, 7300)), Start);

        Assert.Equal(["OP1", "warm", "OP2"], plan.Points.Select(p => p.Window.Id));
        Assert.Equal(WindowOrigin.RigFile, plan.Points[1].Origin);
        Assert.Equal(pinned, plan.Points[1].Window);
        Assert.Equal(4000.0, Assert.Single(plan.Points[1].Detected).StartS);
        Assert.Equal("warm", plan.Detected[1].PinnedBy);
        Assert.Null(plan.Detected[0].PinnedBy);
    }

    [Fact]
    public void Detected_ids_skip_the_ids_the_rig_file_already_uses()
    {
        var pinned = new TimeWindow("OP2", DayStartS + 4100, DayStartS + 4400);
        var plan = PointWindows.Plan([pinned], Detection(Detected(1000, 1300), Detected(4000, 4300), Detected(7000, 7300)), Start);

        Assert.Equal(["OP1", "OP2", "OP3"], plan.Points.Select(p => p.Window.Id));
        Assert.Equal([WindowOrigin.Detected, WindowOrigin.RigFile, WindowOrigin.Detected], plan.Points.Select(p => p.Origin));
        Assert.Equal(DayStartS + 7000, plan.Points[2].Window.StartS);
    }

    [Fact]
    public void A_detected_window_overlapping_two_pinned_ones_goes_to_the_larger_overlap()
    {
        var a = new TimeWindow("A", DayStartS + 900, DayStartS + 1050);   // 50 s overlap with 1000–1300
        var b = new TimeWindow("B", DayStartS + 1100, DayStartS + 1500);  // 200 s overlap
        var plan = PointWindows.Plan([a, b], Detection(Detected(1000, 1300)), Start);

        Assert.Equal(2, plan.Points.Count);
        Assert.Empty(plan.Points.Single(p => p.Window.Id == "A").Detected);
        Assert.Single(plan.Points.Single(p => p.Window.Id == "B").Detected);
    }

    [Fact]
    public void Pinned_windows_outside_or_beyond_the_detected_stretch_are_warned_about()
    {
        var inside = new TimeWindow("in", DayStartS + 1000, DayStartS + 1300);      // stretch 400–1300
        var early = new TimeWindow("early", DayStartS + 3200, DayStartS + 3500);    // stretch 3400–4300
        var lonely = new TimeWindow("lonely", DayStartS + 9000, DayStartS + 9300);
        var plan = PointWindows.Plan([inside, early, lonely], Detection(Detected(1000, 1300), Detected(4000, 4300)), Start);

        var warnings = PointWindows.PinnedWarnings(plan, Start);

        Assert.Equal(2, warnings.Count);
        Assert.Contains("point 'early': the pinned window 3200–3500 s reaches outside the detected steady stretch 3400–4300 s", warnings[0], StringComparison.Ordinal);
        Assert.Contains("point 'lonely': no detected steady window overlaps", warnings[1], StringComparison.Ordinal);
    }
}
