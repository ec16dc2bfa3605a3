using BcPrep.Calibration;
using BcPrep.Profiles;
using BcPrep.Uncertainty;

namespace BcPrep.Rig;

/// <summary>
/// The typed choices of the rig file and their spellings: parsed once by <see cref="RigLoader"/>, never turned back
/// from text downstream. <c>RigName()</c> gives the word a rig file uses for a value.
/// </summary>
public static class RigChoices
{
    /// <summary><c>type</c> of a thermocouple channel.</summary>
    public static readonly RigSpelling<ThermocoupleType> ThermocoupleTypes = new(
        ("K", ThermocoupleType.K), ("T", ThermocoupleType.T), ("J", ThermocoupleType.J), ("E", ThermocoupleType.E), ("N", ThermocoupleType.N));

    /// <summary><c>distribution</c> of an uncertainty term's limits.</summary>
    public static readonly RigSpelling<DistributionKind> Distributions = new(
        ("rectangular", DistributionKind.Rectangular), ("normal", DistributionKind.Normal), ("triangular", DistributionKind.Triangular),
        ("arcsine", DistributionKind.ArcSine));

    /// <summary><c>[profiles] velocity_model</c>.</summary>
    public static readonly RigSpelling<VelocityProfileModel> VelocityModels = new(
        ("auto", VelocityProfileModel.Auto), ("uniform", VelocityProfileModel.Uniform), ("laminar", VelocityProfileModel.Laminar),
        ("power_law", VelocityProfileModel.PowerLaw), ("spalding", VelocityProfileModel.Spalding), ("reichardt", VelocityProfileModel.Reichardt));

    public static string RigName(this ThermocoupleType type) => ThermocoupleTypes.WordOf(type);

    public static string RigName(this DistributionKind distribution) => Distributions.WordOf(distribution);

    public static string RigName(this VelocityProfileModel model) => VelocityModels.WordOf(model);
}
