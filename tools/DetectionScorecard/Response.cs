namespace BcPrep.Tools.Scorecard;

/// <summary>
/// How one quantity of a generated day answers a step of its target, exact at any time (no time stepping). The state
/// has two numbers; <see cref="Advance"/> moves it over a span with the target held, <see cref="Value"/> reads the
/// quantity. The settling estimate of the detector fits a first-order approach, so the other shapes test it on
/// responses it does not model: two lags in series (a wall behind its heater and lagging), a first-order lag with a
/// slow creep (a part of the rise that comes through a slower path), and an underdamped approach with a small
/// overshoot (a flow controller).
/// </summary>
public abstract record Response
{
    /// <summary>The state at rest on <paramref name="target"/>.</summary>
    public abstract (double A, double B) Rest(double target);

    /// <summary>The state after <paramref name="spanS"/> seconds with the target held at <paramref name="target"/>.</summary>
    public abstract (double A, double B) Advance((double A, double B) state, double target, double spanS);

    public abstract double Value((double A, double B) state);

    /// <summary>The longest time constant of the shape (s): how long a departure can take to die away.</summary>
    public abstract double SlowestTauS { get; }

    /// <summary>A short name for the day lines and the scorecard's breakdown.</summary>
    public abstract string Name { get; }
}

/// <summary>x' = (T − x)/τ: the shape the generator had alone before.</summary>
public sealed record FirstOrder(double TauS) : Response
{
    public override (double A, double B) Rest(double target) => (target, 0.0);

    public override (double A, double B) Advance((double A, double B) state, double target, double spanS) =>
        (target + ((state.A - target) * Math.Exp(-spanS / TauS)), 0.0);

    public override double Value((double A, double B) state) => state.A;

    public override double SlowestTauS => TauS;

    public override string Name => "first-order";
}

/// <summary>
/// Two first-order lags in series, y' = (T − y)/τ₁, x' = (y − x)/τ₂ (τ₁ ≠ τ₂): an S-shaped, overdamped approach. With
/// u = y − T and v = x − T over a span, u(t) = u₀e^(−t/τ₁) and v(t) = (v₀ − D)e^(−t/τ₂) + D e^(−t/τ₁), D = u₀τ₁/(τ₁ − τ₂).
/// State: A = y, B = x.
/// </summary>
public sealed record TwoLags(double Tau1S, double Tau2S) : Response
{
    public override (double A, double B) Rest(double target) => (target, target);

    public override (double A, double B) Advance((double A, double B) state, double target, double spanS)
    {
        var u0 = state.A - target;
        var v0 = state.B - target;
        var d = u0 * Tau1S / (Tau1S - Tau2S);
        var e1 = Math.Exp(-spanS / Tau1S);
        var e2 = Math.Exp(-spanS / Tau2S);
        return (target + (u0 * e1), target + ((v0 - d) * e2) + (d * e1));
    }

    public override double Value((double A, double B) state) => state.B;

    public override double SlowestTauS => Math.Max(Tau1S, Tau2S);

    public override string Name => "two lags";
}

/// <summary>
/// A first-order lag carrying most of the change and a slower one carrying a small fraction f of it, in parallel:
/// x = p + q, p' = ((1 − f)T − p)/τ, q' = (fT − q)/τ_creep. The tail creeps on after the main approach has died.
/// State: A = p, B = q.
/// </summary>
public sealed record Creep(double TauS, double Fraction, double CreepTauS) : Response
{
    public override (double A, double B) Rest(double target) => ((1 - Fraction) * target, Fraction * target);

    public override (double A, double B) Advance((double A, double B) state, double target, double spanS)
    {
        var p = (1 - Fraction) * target;
        var q = Fraction * target;
        return (p + ((state.A - p) * Math.Exp(-spanS / TauS)), q + ((state.B - q) * Math.Exp(-spanS / CreepTauS)));
    }

    public override double Value((double A, double B) state) => state.A + state.B;

    public override double SlowestTauS => Math.Max(TauS, CreepTauS);

    public override string Name => "creep";
}

/// <summary>
/// An underdamped second-order approach, e'' + 2ζω e' + ω² e = 0 with e = x − T, whose envelope decays with time
/// constant τ = 1/(ζω): ζ = 0.6–0.8 overshoots by 9.5–1.5 %, exp(−πζ/√(1 − ζ²)). Over a span,
/// e(t) = e^(−ζωt)[e₀ cos ω_d t + ((e₀' + ζω e₀)/ω_d) sin ω_d t], ω_d = ω√(1 − ζ²). State: A = x, B = x'.
/// </summary>
public sealed record Overshoot(double TauS, double Damping) : Response
{
    public override (double A, double B) Rest(double target) => (target, 0.0);

    public override (double A, double B) Advance((double A, double B) state, double target, double spanS)
    {
        var omega = 1.0 / (Damping * TauS);
        var a = Damping * omega;
        var wd = omega * Math.Sqrt(1 - (Damping * Damping));
        var e0 = state.A - target;
        var d0 = state.B;
        var envelope = Math.Exp(-a * spanS);
        var (sin, cos) = Math.SinCos(wd * spanS);
        var e = envelope * ((e0 * cos) + ((d0 + (a * e0)) / wd * sin));
        var d = envelope * ((d0 * cos) - (((a * d0) + (omega * omega * e0)) / wd * sin));
        return (target + e, d);
    }

    public override double Value((double A, double B) state) => state.A;

    public override double SlowestTauS => TauS;

    public override string Name => "overshoot";
}
