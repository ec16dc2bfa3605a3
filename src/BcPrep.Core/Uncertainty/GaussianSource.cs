namespace BcPrep.Uncertainty;

/// <summary>
/// Standard normal draws by the Box–Muller transform on a seeded <see cref="Random"/>; both values of each pair
/// are used. Deterministic for a given seed (System.Random with a seed keeps its algorithm across .NET versions).
/// </summary>
internal sealed class GaussianSource
{
    private readonly Random _random;
    private double _spare;
    private bool _hasSpare;

    public GaussianSource(Random random)
    {
        _random = random;
    }

    public double Next()
    {
        if (_hasSpare)
        {
            _hasSpare = false;
            return _spare;
        }

        var u1 = 1.0 - _random.NextDouble(); // (0, 1]: keeps the logarithm finite.
        var u2 = _random.NextDouble();
        var radius = Math.Sqrt(-2.0 * Math.Log(u1));
        var angle = 2.0 * Math.PI * u2;
        _spare = radius * Math.Sin(angle);
        _hasSpare = true;
        return radius * Math.Cos(angle);
    }
}
