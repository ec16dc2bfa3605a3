using BcPrep.Pipeline;
using BcPrep.Reading;
using BcPrep.Rig;

namespace BcPrep.Tests.Reading;

public class ReadProgressTests
{
    [Fact]
    public void A_scan_reports_every_byte_of_the_day_up_to_the_last_record()
    {
        var rig = RigLoader.Load(File.ReadAllText(Tests.Rig.RigLoaderTests.SampleRigPath), "rig");
        var logs = Directory.GetFiles(Path.Combine(RepoRoot.Path, "sample-logs"), "*.csv").Order(StringComparer.Ordinal).Select(LogInput.FromPath).ToList();
        var total = logs.Sum(l => new FileInfo(l.Path).Length);
        var progress = new ReadProgress(total);

        DayScan.Run(rig, DayPlan.Create(rig, logs), rig.Channels.ToDictionary(c => c.Id, BlockConverter.For), [], progress: progress);

        Assert.Equal(1, progress.Pass);
        // Offsets count to the start of each file's last record, so at most one short row per file is missing.
        Assert.InRange(progress.PassBytes, total - (logs.Count * 200), total);
        Assert.Equal("pass 1, 99 %", progress.Describe());
    }

    [Fact]
    public void A_new_pass_starts_again_from_zero()
    {
        var progress = new ReadProgress(1000);
        progress.StartPass();
        progress.Advance(600);
        Assert.Equal("pass 1, 60 %", progress.Describe());
        progress.StartPass();
        progress.Advance(250);
        Assert.Equal("pass 2, 25 %", progress.Describe());
    }
}
