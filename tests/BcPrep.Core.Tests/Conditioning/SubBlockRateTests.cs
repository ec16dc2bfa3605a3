using BcPrep.Conditioning;

namespace BcPrep.Tests.Conditioning;

public class SubBlockRateTests
{
    // Whole-period arithmetic (common practice: a boxcar of whole periods has a zero at the mains frequency and at
    // every harmonic), with the margin of 40 between sub-block rate and cutoff that the class documents.
    [Theory]
    [InlineData(0.001, 50.0, 0.5, 25)]    // 1 kHz, 50 Hz, 0.5 Hz: 40 ms = 2 periods, 25 Hz ≥ 40 · 0.5 Hz
    [InlineData(0.001, 60.0, 0.5, 20)]    // 60 Hz: 50 ms = 3 periods and 50 samples; 20 Hz ≥ 20 Hz
    [InlineData(0.001, 50.0, null, 25)]   // notch alone: at least 20 sub-blocks, of whole periods: 25 of 2 periods
    [InlineData(0.025, 50.0, null, 10)]   // 40 Hz: at most 10 sub-blocks of 4 samples, 50 Hz needs whole periods: 10 of 5
    [InlineData(0.002, 50.0, 1.0, 50)]    // 500 Hz: 20 ms = 1 period = 10 samples; 50 Hz ≥ 40 Hz
    [InlineData(0.001, null, 0.5, 20)]    // low-pass alone: the fewest sub-blocks with 20 Hz ≥ 40 · 0.5 Hz
    public void Picks_the_fewest_sub_blocks_that_hold_whole_mains_periods_and_keep_the_cutoff_margin(double intervalS, double? mainsHz, double? cutoffHz, int expected)
    {
        Assert.Equal(expected, SubBlockRate.SubBlocksPerBlock(intervalS, 1.0, mainsHz, cutoffHz));
    }

    [Theory]
    [InlineData(0.5, 50.0, 0.2)]          // the sample day's 2 Hz: fewer than 4 samples a block
    [InlineData(0.001, 50.0, 20.0)]       // a 20 Hz cutoff needs 800 sub-blocks, and none of whole periods fits
    [InlineData(0.0015, 50.0, 0.5)]       // 666.67 samples a block: not a whole number
    public void Gives_none_when_no_split_fits(double intervalS, double? mainsHz, double? cutoffHz)
    {
        Assert.Null(SubBlockRate.SubBlocksPerBlock(intervalS, 1.0, mainsHz, cutoffHz));
    }
}
