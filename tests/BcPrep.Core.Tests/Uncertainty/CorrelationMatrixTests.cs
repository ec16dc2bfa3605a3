using BcPrep.Uncertainty;

namespace BcPrep.Tests.Uncertainty;

public class CorrelationMatrixTests
{
    [Fact]
    public void Pairs_expand_to_a_symmetric_matrix()
    {
        var r = CorrelationMatrix.FromPairs(3, [(0, 1, -0.36), (0, 2, 0.86), (1, 2, -0.65)]);
        Assert.Equal(-0.36, r[1, 0]);
        Assert.Equal(0.86, r[2, 0]);
        Assert.Equal(-0.65, r[2, 1]);
        Assert.Equal(1.0, r[1, 1]);
        Assert.True(r.HasCorrelations);
        Assert.False(CorrelationMatrix.Identity(3).HasCorrelations);
    }

    [Fact]
    public void Asymmetric_matrix_throws()
    {
        Assert.Throws<BcPrepDataException>(() => CorrelationMatrix.FromMatrix(new[,] { { 1.0, 0.2 }, { 0.3, 1.0 } }));
    }

    [Fact]
    public void Coefficient_above_one_throws()
    {
        Assert.Throws<BcPrepDataException>(() => CorrelationMatrix.FromPairs(2, [(0, 1, 1.2)]));
    }

    [Fact]
    public void Inconsistent_correlations_are_not_positive_semi_definite()
    {
        // x0 strongly with x1 and x2, but x1 and x2 strongly anti-correlated: impossible (eigenvalue < 0).
        var ex = Assert.Throws<BcPrepDataException>(() =>
            CorrelationMatrix.FromPairs(3, [(0, 1, 0.9), (0, 2, 0.9), (1, 2, -0.9)]));
        Assert.Contains("positive semi-definite", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Perfect_correlation_is_accepted_as_semi_definite()
    {
        var r = CorrelationMatrix.FromPairs(2, [(0, 1, 1.0)]);
        Assert.Equal(1.0, r[0, 1]);
    }

    [Fact]
    public void Bad_pair_indices_throw()
    {
        Assert.Throws<BcPrepDataException>(() => CorrelationMatrix.FromPairs(2, [(0, 0, 0.5)]));
        Assert.Throws<BcPrepDataException>(() => CorrelationMatrix.FromPairs(2, [(0, 2, 0.5)]));
    }

    [Fact]
    public void Covariance_is_r_times_u_i_u_j()
    {
        var cov = CorrelationMatrix.FromPairs(2, [(0, 1, 0.5)]).ToCovariance([2.0, 3.0]);
        Assert.Equal(4.0, cov[0, 0]);
        Assert.Equal(3.0, cov[0, 1]);
        Assert.Equal(9.0, cov[1, 1]);
    }
}
