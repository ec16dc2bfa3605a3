namespace BcPrep.Writing;

/// <summary>The cautions every output carries (README "Cautions" says the same).</summary>
public static class Cautions
{
    public static readonly string[] All =
    [
        "These boundary conditions come from measurements on a heated, possibly pressurized rig and feed engineering decisions: check them independently before use.",
        "Uncertainties cover the measurement chain declared in the rig file and the model form of the property models, of the inlet turbulence-intensity correlation and of the power-law profile's exponent; errors not declared there (installation effects, sensor lag, the shape of the wall-law profiles, an undeclared drift) are not included.",
        "Local codes, the rig's safety case and licensed engineering practice govern the operation of the rig and the use of these numbers; BcPrep does not replace them.",
    ];
}
