namespace BcPrep.Tools.SampleDay;

/// <summary>Correlated (AR(1)) Gaussian noise with a given marginal standard deviation, from a seeded generator.</summary>
internal sealed class Ar1Noise(Random random, double sigma, double phi)
{
    private readonly double _innovation = sigma * Math.Sqrt(1 - (phi * phi));
    private double _state;

    public double Next()
    {
        _state = (phi * _state) + (_innovation * Gaussian());
        return _state;
    }

    private double Gaussian()
    {
        // Box–Muller; one of the pair is enough here.
        var u1 = 1.0 - random.NextDouble();
        var u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }
}
