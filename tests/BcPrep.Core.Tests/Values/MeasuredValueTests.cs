using BcPrep.Values;

namespace BcPrep.Tests.Values;

public class MeasuredValueTests
{
    [Fact]
    public void Relative_uncertainty_is_u_over_abs_value()
    {
        Assert.Equal(0.02, new MeasuredValue(-50.0, 1.0, 10).RelativeUncertainty, 15);
    }
}
