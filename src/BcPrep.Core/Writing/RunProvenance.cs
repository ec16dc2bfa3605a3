namespace BcPrep.Writing;

/// <summary>What a run was made from: tool version and the SHA-256 of the rig file and every log.</summary>
public sealed record RunProvenance(string ToolVersion, InputFingerprint Rig, IReadOnlyList<InputFingerprint> Logs)
{
    /// <summary>The test-matrix file, when one is given.</summary>
    public InputFingerprint? Matrix { get; init; }

    /// <summary>Choices that change the outputs (e.g. allowed expired calibrations), as "name=value" texts.</summary>
    public IReadOnlyList<string> Choices { get; init; } = [];

    /// <summary>One hash over everything, for the quick "nothing changed" test of incremental runs.</summary>
    public string Key => Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(
        ToolVersion + "|" + Rig.Sha256 + "|" + string.Join("|", Logs.Select(l => l.Sha256).Order(StringComparer.Ordinal)) + Extras())));

    // Empty when no matrix and no choices, so the keys of existing manifests stay valid.
    private string Extras() =>
        (Matrix is null ? "" : "|matrix:" + Matrix.Sha256) + string.Concat(Choices.Order(StringComparer.Ordinal).Select(c => "|" + c));
}

/// <summary>A file's name as given, size and content hash.</summary>
public sealed record InputFingerprint(string Name, long Bytes, string Sha256);
