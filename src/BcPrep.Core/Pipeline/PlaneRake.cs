using System.Collections.Immutable;

namespace BcPrep.Pipeline;

/// <summary>The measured rake of one plane: each sensor's radius (m from the axis) and temperature (K), in rig order.</summary>
public sealed record PlaneRake(string Plane, ImmutableArray<double> RadiiM, ImmutableArray<double> TemperaturesK);
