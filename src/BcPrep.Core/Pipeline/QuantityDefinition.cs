namespace BcPrep.Pipeline;

/// <summary>A named scalar output of the point model, with its SI unit and what it is.</summary>
public sealed record QuantityDefinition(string Name, string Unit, string Description);
