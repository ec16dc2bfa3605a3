using System.Collections;
using System.Globalization;
using System.Reflection;
using System.Text;
using BcPrep.Conditioning;

namespace BcPrep.Tests.Pipeline;

/// <summary>One channel's window as a logger would hand it over, with the limits to screen it with.</summary>
internal sealed record GeneratedWindow(string Name, double[] TimesS, double[] Values, SensorFaultLimits Limits)
{
    public override string ToString() => Name;
}

/// <summary>
/// Generated windows with every kind of gap (short ones bridged as NaN cells or as time jumps, long ones left open,
/// at the edges, NaN and ±∞ cells), spikes, rails (declared and the window's own), stuck, quantised and pile-up
/// samples. Times are on the epoch-seconds clock, so their steps vary in the last bits as a logger's do.
/// </summary>
internal static class GeneratedWindows
{
    /// <summary>2026-11-24 09:00 UTC in seconds since 1970.</summary>
    public const double DayStartS = 1_795_510_800.0;

    private static readonly Lazy<IReadOnlyList<GeneratedWindow>> Cached = new(() => [.. Generate()]);

    /// <summary>The windows, generated once per test run (the arrays must not be changed).</summary>
    public static IReadOnlyList<GeneratedWindow> All() => Cached.Value;

    private static IEnumerable<GeneratedWindow> Generate()
    {
        foreach (var seed in Enumerable.Range(1, 4))
        {
            foreach (var (name, rateHz, n) in new[] { ("1 kHz", 1000.0, 30_000 + (seed * 1731)), ("10 Hz", 10.0, 700 + (seed * 97)) })
            {
                foreach (var shape in Shapes)
                {
                    yield return Build($"{shape.Name}, {name}, seed {seed}", rateHz, n, seed, shape.Apply);
                }
            }
        }
    }

    public static GeneratedWindow Build(string name, double rateHz, int n, int seed, Func<Random, double, List<double>, List<double>, SensorFaultLimits> shape)
    {
        var random = new Random(seed);
        var t = new List<double>(n);
        var x = new List<double>(n);
        var start = DayStartS + 900.0 + seed;
        var state = 0.0;
        for (var i = 0; i < n; i++)
        {
            // As the reader makes them: whole ticks since the epoch, divided once.
            t.Add((long)((start * 1e7) + (i * (1e7 / rateHz))) / 1e7);
            state = (0.6 * state) + Gaussian(random);
            x.Add(250.0 + (0.4 * state) + (0.1 * Math.Sin(2 * Math.PI * 50.0 * i / rateHz)));
        }
        var limits = shape(random, rateHz, t, x);
        return new GeneratedWindow(name, [.. t], [.. x], limits);
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble())) * Math.Cos(2.0 * Math.PI * random.NextDouble());

    private static readonly SensorFaultLimits Screening = new(RailTolerance: 0.001, Resolution: 0.002, PlausibleMin: 0.0, PlausibleMax: 1000.0);

    private static readonly (string Name, Func<Random, double, List<double>, List<double>, SensorFaultLimits> Apply)[] Shapes =
    [
        ("clean", (_, _, _, _) => Screening),
        ("short NaN runs bridged", (r, hz, _, x) =>
        {
            for (var k = 0; k < 5; k++)
            {
                NaNRun(x, r.Next(10, x.Count - 10), Math.Max(1, (int)(r.Next(1, 40) * hz / 1000.0)));
            }
            return Screening;
        }),
        ("short time jumps bridged", (r, hz, t, x) =>
        {
            for (var k = 0; k < 4; k++)
            {
                Remove(t, x, r.Next(10, t.Count - 60), Math.Max(1, (int)(r.Next(2, 50) * hz / 1000.0)));
            }
            return Screening;
        }),
        ("long gaps left open", (r, hz, t, x) =>
        {
            NaNRun(x, t.Count / 4, (int)(3.0 * hz)); // 3 s of NaN: over the 2 s bridge limit
            Remove(t, x, t.Count / 2, (int)(2.5 * hz)); // 2.5 s without rows
            NaNRun(x, (3 * t.Count) / 4, 3); // and a short one, bridged
            return Screening;
        }),
        ("NaN and infinities at both edges", (r, hz, _, x) =>
        {
            x[0] = double.NaN;
            x[1] = double.PositiveInfinity;
            x[2] = double.NaN;
            x[^1] = double.NegativeInfinity;
            x[^2] = double.NaN;
            NaNRun(x, x.Count / 3, 2);
            x[x.Count / 2] = double.PositiveInfinity;
            return Screening;
        }),
        ("spikes", (r, _, _, x) =>
        {
            foreach (var i in new[] { 0, 1, 2, 5, x.Count / 3, x.Count / 2, x.Count - 3, x.Count - 1 })
            {
                x[i] += (r.Next(2) == 0 ? -1 : 1) * (3.0 + (5.0 * r.NextDouble()));
            }
            return Screening;
        }),
        ("clipped at a declared rail", (r, _, _, x) =>
        {
            for (var i = 0; i < x.Count; i++)
            {
                x[i] = Math.Min(x[i], 250.3);
            }
            return Screening with { RailHigh = 250.3, RailLow = 10.0 };
        }),
        ("clipped at its own extremes", (r, _, _, x) =>
        {
            for (var i = 0; i < x.Count; i++)
            {
                x[i] = Math.Clamp(x[i], 249.5, 250.45);
            }
            return Screening;
        }),
        ("stuck", (_, _, _, x) =>
        {
            for (var i = 0; i < x.Count; i++)
            {
                x[i] = 21.37;
            }
            return Screening;
        }),
        ("nearly stuck, quantised", (r, _, _, x) =>
        {
            // One level with a few samples one step away: the standard deviation near the stuck threshold.
            for (var i = 0; i < x.Count; i++)
            {
                x[i] = 21.37 + (r.Next(400) == 0 ? 0.002 : 0.0);
            }
            return Screening with { StuckFractionOfResolution = 0.05 };
        }),
        ("quantised", (_, _, _, x) =>
        {
            for (var i = 0; i < x.Count; i++)
            {
                x[i] = Math.Round(x[i] / 0.05) * 0.05;
            }
            return Screening with { Resolution = 0.05, RailTolerance = 0.05 };
        }),
        ("quantised, no resolution given", (_, _, _, x) =>
        {
            for (var i = 0; i < x.Count; i++)
            {
                x[i] = Math.Round(x[i] / 0.125) * 0.125;
            }
            return new SensorFaultLimits(RailTolerance: 0.125);
        }),
        ("pile-up at the top level", (r, _, _, x) =>
        {
            for (var i = 0; i < x.Count; i++)
            {
                x[i] = Math.Min(Math.Round(x[i] / 0.01) * 0.01, 250.2);
            }
            return Screening with { Resolution = 0.01, RailTolerance = 0.01 };
        }),
        ("implausible", (r, _, _, x) =>
        {
            for (var i = x.Count / 5; i < (x.Count / 5) + 30; i++)
            {
                x[i] = 1372.0 + i; // an open thermocouple for a while: a run, so the Hampel filter keeps it
            }
            x[x.Count / 2] = -3.0; // a lone one, de-spiked
            return Screening;
        }),
        ("around zero with signed zeros", (r, _, _, x) =>
        {
            for (var i = 0; i < x.Count; i++)
            {
                x[i] = Math.Max(0.0, x[i] - 250.0);
            }
            x[x.Count / 3] = -0.0;
            return new SensorFaultLimits(RailTolerance: 0.001);
        }),
        ("negative, clipped at zero from below", (r, _, _, x) =>
        {
            for (var i = 0; i < x.Count; i++)
            {
                x[i] = Math.Min(-0.0, x[i] - 250.2);
            }
            return new SensorFaultLimits(RailTolerance: 0.0, Resolution: 0.0);
        }),
        ("large offset, small scatter", (r, _, _, x) =>
        {
            for (var i = 0; i < x.Count; i++)
            {
                x[i] = 101_325.0 + ((x[i] - 250.0) * 1e-6);
            }
            return new SensorFaultLimits(Resolution: 1e-7, RailTolerance: 1e-7);
        }),
    ];

    private static void NaNRun(List<double> x, int start, int length)
    {
        for (var i = start; i < Math.Min(x.Count, start + length); i++)
        {
            x[i] = double.NaN;
        }
    }

    private static void Remove(List<double> t, List<double> x, int start, int count)
    {
        count = Math.Min(count, t.Count - start - 1);
        t.RemoveRange(start, count);
        x.RemoveRange(start, count);
    }

    /// <summary>
    /// Every public value of a result, doubles as their bit patterns (so −0 differs from 0 and NaN payloads count),
    /// lists element by element: two results describe alike exactly when they are equal to the bit.
    /// </summary>
    public static string Describe(object? value)
    {
        var text = new StringBuilder();
        Describe(value, text, 0);
        return text.ToString();
    }

    private static void Describe(object? value, StringBuilder text, int depth)
    {
        switch (value)
        {
            case null:
                text.Append("null");
                return;
            case double d:
                text.Append(CultureInfo.InvariantCulture, $"{d:R}[{BitConverter.DoubleToInt64Bits(d):X16}]");
                return;
            case string or int or long or bool or Enum:
                text.Append(CultureInfo.InvariantCulture, $"{value}");
                return;
            case IEnumerable items:
                text.Append('[');
                foreach (var item in items)
                {
                    Describe(item, text, depth + 1);
                    text.Append(", ");
                }
                text.Append(']');
                return;
        }

        if (depth > 8)
        {
            throw new InvalidOperationException("Too deep: " + value.GetType());
        }

        text.Append(value.GetType().Name).Append(" { ");
        foreach (var property in value.GetType().GetProperties(BindingFlags.Public | BindingFlags.Instance).OrderBy(p => p.Name, StringComparer.Ordinal))
        {
            if (property.GetIndexParameters().Length > 0)
            {
                continue;
            }
            text.Append(property.Name).Append(" = ");
            Describe(property.GetValue(value), text, depth + 1);
            text.Append("; ");
        }
        text.Append('}');
    }
}
