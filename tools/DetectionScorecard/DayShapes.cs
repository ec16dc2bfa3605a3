namespace BcPrep.Tools.Scorecard;

/// <summary>
/// The response shapes of one generated day: one for the thermal quantities (outlet bulk and wall temperatures) and
/// one for the mass flow. Drawn from a generator of their own, seeded from the day's seed, so the day's other draws
/// (rate, points, time constants, noise, spikes, gaps) are those the seed gave before the shapes existed; the steps
/// move only as far as the new shapes take longer or shorter to settle.
/// <list type="bullet">
/// <item>thermal: a third each first-order (as before), two lags in series (the drawn τ split 65–85 % / 15–35 %, the same
/// sum), and first-order with a slow creep (3–8 % of the change through a lag 2–3 times slower);</item>
/// <item>flow: half first-order, half underdamped with 1.5–9.5 % overshoot (ζ 0.6–0.8) and the drawn τ as its envelope.</item>
/// </list>
/// </summary>
public sealed record DayShapes(string Thermal, double SplitOrFraction, double CreepFactor, double? FlowDamping)
{
    /// <summary>Every quantity a first-order lag: the generator as it was.</summary>
    public static DayShapes FirstOrder { get; } = new("first-order", 0, 0, null);

    public static DayShapes Draw(int seed)
    {
        var random = new Random(unchecked((seed * 7919) + 104_729));
        var thermal = random.Next(3) switch
        {
            0 => "first-order",
            1 => "two lags",
            _ => "creep",
        };
        var split = thermal == "two lags" ? Uniform(random, 0.15, 0.35) : Uniform(random, 0.03, 0.08);
        var creepFactor = Uniform(random, 2.0, 3.0);
        double? damping = random.NextDouble() < 0.5 ? Uniform(random, 0.6, 0.8) : null;
        return new DayShapes(thermal, split, creepFactor, damping);
    }

    /// <summary>The response of a thermal quantity whose drawn time constant is <paramref name="tauS"/>.</summary>
    public Response ThermalResponse(double tauS) => Thermal switch
    {
        "two lags" => new TwoLags((1 - SplitOrFraction) * tauS, SplitOrFraction * tauS),
        "creep" => new Creep(tauS, SplitOrFraction, CreepFactor * tauS),
        _ => new FirstOrder(tauS),
    };

    public Response FlowResponse(double tauS) => FlowDamping is double zeta ? new Overshoot(tauS, zeta) : new FirstOrder(tauS);

    /// <summary>For the day lines: e.g. "two lags, flow overshoot".</summary>
    public string Describe() => FlowDamping is null ? Thermal : Thermal + ", flow overshoot";

    private static double Uniform(Random random, double low, double high) => low + ((high - low) * random.NextDouble());
}
