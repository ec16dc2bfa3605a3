using System.Globalization;
using BcPrep.Uncertainty;

namespace BcPrep.Pipeline;

/// <summary>How the input vectors of an ensemble are drawn.</summary>
public enum EnsembleSampling
{
    /// <summary>Independent random draws, each member on a stream of its own seed (<see cref="IndependentDraws"/>).</summary>
    Random,

    /// <summary>One Latin hypercube over all members (<see cref="LatinHypercube"/>): every input's strata hit once.</summary>
    LatinHypercube,
}

/// <summary>
/// One member of an ensemble: a draw of every input of the point model and what the same physics makes of it.
/// <paramref name="Number"/> counts from 1; <paramref name="DrawSeed"/> is the member's own seed (random sampling)
/// or null (Latin hypercube, where members are drawn jointly). <paramref name="Outputs"/> follow
/// <see cref="PointModel.Outputs"/>; an output the physics does not define for this draw is NaN.
/// </summary>
public sealed record EnsembleMember(int Number, int? DrawSeed, double[] Inputs, PointQuantities Quantities, double[] Outputs);

/// <summary>
/// Draws complete boundary-condition sets of one operating point from the joint distribution of its inputs. The
/// inputs of <see cref="PointModel"/> are mutually independent (correlation between outputs comes from inputs they
/// share), so drawing each input from its own distribution samples the joint distribution; every member then goes
/// through the same <see cref="PointModel"/> physics, so its profile carries its own mass flow.
/// </summary>
public static class PointEnsemble
{
    /// <summary>Largest ensemble drawn: a member is a folder of files, and 10⁵ of them is already a large job.</summary>
    public const int MaxMembers = 100_000;

    /// <summary>
    /// Yields <paramref name="count"/> members lazily, in order (memory does not grow with the count for random
    /// sampling). Same model, count, seed and sampling give identical members. Throws <see cref="BcPrepFailure"/>
    /// (configuration) for a count outside 1 … <see cref="MaxMembers"/>, and (input data) when the physics cannot
    /// evaluate a member, naming it.
    /// </summary>
    public static IEnumerable<EnsembleMember> Draw(PointModel model, int count, int seed, EnsembleSampling sampling)
    {
        ArgumentNullException.ThrowIfNull(model);
        if (count is < 1 or > MaxMembers)
        {
            throw new BcPrepFailure(FailureKind.Configuration, new SourceLocation("(command line)", Key: "--samples"), string.Create(CultureInfo.InvariantCulture,
                $"ensemble size {count} is outside 1 … {MaxMembers}"));
        }

        return Members(model, count, seed, sampling);
    }

    private static IEnumerable<EnsembleMember> Members(PointModel model, int count, int seed, EnsembleSampling sampling)
    {
        var hypercube = sampling == EnsembleSampling.LatinHypercube ? LatinHypercube.Sample(model.Inputs, count, seed) : null;
        for (var i = 0; i < count; i++)
        {
            int? drawSeed = hypercube is null ? IndependentDraws.SeedOf(seed, i + 1) : null;
            var x = hypercube?[i] ?? IndependentDraws.Draw(model.Inputs, drawSeed!.Value);
            yield return Evaluate(model, i + 1, drawSeed, x);
        }
    }

    private static EnsembleMember Evaluate(PointModel model, int number, int? drawSeed, double[] x)
    {
        try
        {
            return new EnsembleMember(number, drawSeed, x, model.Physics(x), model.Evaluate(x));
        }
        catch (BcPrepDataException e) when (e is not BcPrepFailure)
        {
            throw new BcPrepFailure(FailureKind.InputData, new SourceLocation("(ensemble)", Key: $"member {number}"),
                "the physics cannot evaluate this draw of the inputs: " + e.Message);
        }
    }
}
