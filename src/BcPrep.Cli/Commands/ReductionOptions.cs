using System.CommandLine;
using System.Globalization;
using BcPrep.Pipeline;
using BcPrep.Rig;
using BcPrep.Writing;

namespace BcPrep.Cli.Commands;

/// <summary>
/// The options that change what the reduction computes. Every command that re-runs the reduction (process, budget,
/// covariance, ensemble) adds them from here and turns them into <see cref="ProcessOptions"/> here, so that a
/// choice accepted by <c>process</c> is accepted, and means the same, everywhere the same numbers are computed.
/// Monte Carlo is offered only where its result is written (<c>process</c>): the budget, the covariance and the
/// ensemble come from the GUM model and the input distributions, which it does not change.
/// </summary>
public sealed class ReductionOptions
{
    private ReductionOptions(bool monteCarlo)
    {
        if (monteCarlo)
        {
            MonteCarlo = new Option<bool>("--monte-carlo") { Description = "Also propagate by Monte Carlo (JCGM 101) and flag where it disagrees with GUM." };
            Seed = new Option<int>("--seed") { Description = "Seed of the Monte Carlo trials.", DefaultValueFactory = _ => 1, HelpName = "N" };
        }
    }

    public Option<string[]> AllowExpired { get; } = LabOptions.AllowExpired();

    public Option<string> Matrix { get; } = LabOptions.Matrix();

    public Option<bool>? MonteCarlo { get; }

    public Option<int>? Seed { get; }

    /// <summary>The options of <c>process</c>, which writes the Monte Carlo results.</summary>
    public static ReductionOptions WithMonteCarlo() => new(monteCarlo: true);

    /// <summary>The options of a command that reports on the GUM model or the input distributions.</summary>
    public static ReductionOptions WithoutMonteCarlo() => new(monteCarlo: false);

    /// <summary>Every option, in the order help lists them.</summary>
    public IReadOnlyList<Option> All => new Option?[] { MonteCarlo, Seed, AllowExpired, Matrix }.OfType<Option>().ToList();

    public void AddTo(Command command)
    {
        foreach (var option in All)
        {
            command.Options.Add(option);
        }
    }

    /// <summary>The expired channels the person allows (none when not given).</summary>
    public IReadOnlyList<string> Allowed(ParseResult parse) => parse.GetValue(AllowExpired) ?? [];

    /// <summary>The test-matrix file, when given.</summary>
    public string? MatrixPath(ParseResult parse) => parse.GetValue(Matrix);

    /// <summary>
    /// The reduction's options as chosen on the command line; reads and checks the test matrix against the rig. The
    /// rows kept back during the read go to the system's temporary folder.
    /// </summary>
    public ProcessOptions Read(ParseResult parse, RigDescription rig) =>
        new(MonteCarlo: MonteCarlo is not null && parse.GetValue(MonteCarlo), Seed: Seed is null ? 1 : parse.GetValue(Seed))
        {
            AllowExpired = Allowed(parse),
            Matrix = MatrixPath(parse) is { } path ? LabOptions.LoadMatrix(path, rig) : null,
            // The rows of the plateau under way go to the system's temporary folder (TMPDIR), not to memory: a long
            // plateau at a high rate is then gathered during the only read, in flat memory (README "Large days").
            KeptRowsFolder = Path.GetTempPath(),
        };

    /// <summary>
    /// <paramref name="provenance"/> with these choices recorded: the test matrix's fingerprint and every choice as
    /// "name=value", so that a run with other choices is never taken for up to date. A run with none of them keeps
    /// the key it had before the choices existed.
    /// </summary>
    public RunProvenance Record(RunProvenance provenance, ParseResult parse, IEnumerable<string> moreChoices)
    {
        var monteCarlo = MonteCarlo is not null && parse.GetValue(MonteCarlo);
        IEnumerable<string> Choices()
        {
            foreach (var channel in Allowed(parse))
            {
                yield return "allow-expired=" + channel;
            }
            if (monteCarlo)
            {
                yield return "monte-carlo";
                yield return "seed=" + parse.GetValue(Seed!).ToString(CultureInfo.InvariantCulture);
            }
        }
        return provenance with
        {
            Choices = Choices().Concat(moreChoices).ToList(),
            Matrix = MatrixPath(parse) is { } path ? LogArguments.Fingerprint(path, path) : null,
        };
    }
}
