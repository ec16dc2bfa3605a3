namespace BcPrep.Pipeline;

/// <summary>
/// What the block means (steady detection and the day plots) are computed from: the calibrated samples, or, when
/// the rig file configures a mains notch or a low-pass, the conditioned samples (bridged, de-spiked, filtered),
/// streamed in chunks; at a fast rate the chain runs on sub-block means that hold whole mains periods
/// (<see cref="SubBlockConditionedFeed"/>), since only block means are consumed. The window means and Type A uncertainties never see the filters: they come from the
/// window collector's unfiltered samples.
/// </summary>
internal sealed class DetectionFeed
{
    private readonly SubBlockConditionedFeed? _conditioned;

    private DetectionFeed(BlockMeanSink blocks, SubBlockConditionedFeed? conditioned)
    {
        Blocks = blocks;
        _conditioned = conditioned;
    }

    public BlockMeanSink Blocks { get; }

    /// <summary>The block sink to scan with: the block means themselves, or the conditioning chain that feeds them.</summary>
    public IBlockSink BlockSink => _conditioned is null ? Blocks : _conditioned;

    public static DetectionFeed For(Rig.RigDescription rig, BlockMeanSink blocks)
    {
        var filtered = rig.Conditioning.LowPassCutoffHz is not null || rig.Conditioning.MainsHz is not null;
        return new DetectionFeed(blocks, filtered ? new SubBlockConditionedFeed(rig, blocks) : null);
    }

    /// <summary>Flushes the conditioned rows still held back by the chunking; call after the scan.</summary>
    public void Complete() => _conditioned?.Complete();
}
