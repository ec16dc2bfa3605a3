namespace BcPrep.Pipeline;

/// <summary>
/// What the block means (steady detection and the day plots) are computed from: the calibrated samples de-spiked by
/// the Hampel rule block by block (<see cref="DespikedBlockFeed"/>), or, when the rig file configures a mains notch or
/// a low-pass, the conditioned samples (bridged, de-spiked, filtered), streamed in chunks; at a fast rate the chain
/// runs on sub-block means that hold whole mains periods (<see cref="SubBlockConditionedFeed"/>), since only block
/// means are consumed. Either way spikes are removed before the block means. The window means and Type A
/// uncertainties never see the filters: they come from the window collector's unfiltered samples.
/// </summary>
internal sealed class DetectionFeed
{
    private readonly SubBlockConditionedFeed? _conditioned;
    private readonly DespikedBlockFeed? _despiked;

    private DetectionFeed(BlockMeanSink blocks, SubBlockConditionedFeed? conditioned, DespikedBlockFeed? despiked)
    {
        Blocks = blocks;
        _conditioned = conditioned;
        _despiked = despiked;
    }

    public BlockMeanSink Blocks { get; }

    /// <summary>The block sink to scan with: the de-spiking feed, or the conditioning chain that feeds the block means.</summary>
    public IBlockSink BlockSink => (IBlockSink?)_conditioned ?? _despiked!;

    public static DetectionFeed For(Rig.RigDescription rig, BlockMeanSink blocks)
    {
        var filtered = rig.Conditioning.LowPassCutoffHz is not null || rig.Conditioning.MainsHz is not null;
        return filtered
            ? new DetectionFeed(blocks, new SubBlockConditionedFeed(rig, blocks), null)
            : new DetectionFeed(blocks, null, new DespikedBlockFeed(rig, blocks));
    }

    /// <summary>
    /// Averages the blocks the de-spiking still holds back, so that the block means so far are complete, and lets the
    /// scan go on (a block that continues is then added to in parts); for <c>follow</c>'s day so far. The conditioning
    /// chain's chunk is left as it is.
    /// </summary>
    public void Settle() => _despiked?.Complete();

    /// <summary>Flushes the rows and blocks still held back by the chunking; call after the scan.</summary>
    public void Complete()
    {
        _conditioned?.Complete();
        _despiked?.Complete();
    }
}
