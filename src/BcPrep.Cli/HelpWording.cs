using System.CommandLine;
using System.CommandLine.Help;

namespace BcPrep.Cli;

/// <summary>
/// The built-in --help and --version options described in BcPrep's words rather than the parser's stock English;
/// placeholders are set on each option (HelpName) as the README writes them: &lt;DIR&gt;, &lt;CHANNEL&gt;, &lt;ID&gt;, &lt;N&gt;, &lt;FILE&gt;.
/// </summary>
internal static class HelpWording
{
    public static void Apply(RootCommand root)
    {
        // Otherwise help is headed by the host's file name (testhost, dotnet) whenever bcprep is not started as "bcprep".
        root.HelpName = "bcprep";
        foreach (var option in root.Options)
        {
            option.Description = option switch
            {
                HelpOption => "Show this help, with an example.",
                VersionOption => "Print the tool version (the one the manifest records).",
                _ => option.Description,
            };
        }
    }
}
