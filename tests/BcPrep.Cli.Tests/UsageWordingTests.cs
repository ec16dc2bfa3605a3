using BcPrep.Cli;
using BcPrep.Tests.Cli.Support;

namespace BcPrep.Tests.Cli;

/// <summary>
/// Help and usage errors speak BcPrep's words: placeholders as the README writes them, every parser error as an
/// "error: (command line): …" problem on standard error, one follow-up line, exit code 2 and nothing on standard
/// output. The texts are pinned whole, so a library upgrade that brings back its stock English fails here.
/// </summary>
public sealed class UsageWordingTests
{
    private const string Commands = "check, process, calibrate, budget, covariance, ensemble, windows, follow";

    [Fact]
    public void Ensemble_help_screen_is_pinned_with_the_readme_placeholders()
    {
        var run = CliRunner.Run("ensemble", "--help");

        Assert.Equal(0, run.ExitCode);
        Assert.Equal("", run.Error);
        Assert.Equal("""
            Description:
              Write N complete boundary-condition sets of one point, drawn from the joint distribution of its inputs through the same physics.
              Example: bcprep ensemble sample-logs/marten-rig.toml sample-logs/*.csv --point OP1 --samples 50 --seed 7 --out ens

            Usage:
              bcprep ensemble <RIG> <LOG>... [options]

            Arguments:
              <RIG>  The rig description file (TOML).
              <LOG>  Log files of the day, any order; '-' reads standard input.

            Options:
              --point <ID> (REQUIRED)       The operating point, by its id (as in summary.csv, e.g. OP1).
              -n, --samples <N> (REQUIRED)  Number of members (1 … 100000).
              --seed <N>                    Seed of the draws; the same seed gives the same files. [default: 1]
              --latin-hypercube             Draw the members as one Latin hypercube instead of independent random draws.
              -o, --out <DIR> (REQUIRED)    Output folder (replaced as a whole; refused if it holds anything but an earlier ensemble).
              --allow-expired <CHANNEL>     Use this channel's data although its calibration due date has passed (repeatable; 'all' for every channel). Recorded in the manifest.
              --matrix <FILE>               Test-matrix CSV of planned points; matched operating points take its names (see README, 'The test matrix').
              -?, -h, --help                Show this help, with an example.
              -q, --quiet                   Print nothing on standard error but errors.
              -v, --verbose                 Explain each step on standard error.


            """, run.Out.Replace("\r\n", "\n", StringComparison.Ordinal));
    }

    [Fact]
    public void No_option_help_shows_a_placeholder_made_from_its_own_name()
    {
        foreach (var command in new[] { "check", "process", "calibrate", "budget", "covariance", "ensemble", "windows", "follow" })
        {
            var help = CliRunner.Run(command, "--help").Out;

            // The parser's default placeholder is the option's name in lower case (<out>, <allow-expired>).
            Assert.DoesNotMatch(@"--([a-z-]+) <\1>", help);
            Assert.DoesNotContain("Show help and usage information", help, StringComparison.Ordinal);
        }
    }

    public static TheoryData<string[], string> UsageErrors => new()
    {
        // missing command
        { [], $"error: (command line): no command given; the commands are {Commands}\nSee 'bcprep --help'.\n" },
        // unknown command, with the near miss named
        { ["proces"], $"error: (command line): unknown command 'proces' (did you mean 'process'?); the commands are {Commands}\nSee 'bcprep --help'.\n" },
        // unknown option
        { ["check", "rig.toml", "--dat"], "error: (command line): unknown option '--dat' (did you mean '--date'?)\nSee 'bcprep check --help'.\n" },
        // unknown (extra) argument
        { ["check", "rig.toml", "other.toml"], "error: (command line): unexpected argument 'other.toml'\nSee 'bcprep check --help'.\n" },
        // missing required option
        { ["process", "rig.toml", "day.csv"], "error: (command line): --out <DIR> is required\nSee 'bcprep process --help'.\n" },
        // missing argument
        { ["windows", "rig.toml"], "error: (command line): missing <LOG>; the usage is bcprep windows <RIG> <LOG>... [options]\nSee 'bcprep windows --help'.\n" },
        // option without its value
        { ["budget", "rig.toml", "day.csv", "--point"], "error: (command line): --point: needs a value (--point <ID>)\nSee 'bcprep budget --help'.\n" },
        // bad value
        { ["ensemble", "rig.toml", "day.csv", "--point", "OP1", "--samples", "fifty", "--out", "ens"], "error: (command line): --samples: 'fifty' is not a whole number (--samples <N>)\nSee 'bcprep ensemble --help'.\n" },
    };

    [Theory]
    [MemberData(nameof(UsageErrors))]
    public void Usage_error_is_worded_by_bcprep_on_stderr_with_exit_2(string[] args, string expected)
    {
        var run = CliRunner.Run(args);

        Assert.Equal(ExitCodes.UsageOrRigFile, run.ExitCode);
        Assert.Equal("", run.Out);
        Assert.Equal(expected, run.Error.Replace("\r\n", "\n", StringComparison.Ordinal));
    }

    [Fact]
    public void A_usage_problem_found_by_a_command_has_the_same_follow_up()
    {
        var run = CliRunner.Run("process", SampleDay.Rig, SampleDay.Morning, "--out", Path.Combine(Path.GetTempPath(), "never-" + Guid.NewGuid().ToString("N")), "--forse");

        Assert.Equal(ExitCodes.UsageOrRigFile, run.ExitCode);
        Assert.Equal("error: (command line): --forse: unknown option '--forse' (and no log file has that name)\nSee 'bcprep process --help'.\n",
            run.Error.Replace("\r\n", "\n", StringComparison.Ordinal));
    }
}
