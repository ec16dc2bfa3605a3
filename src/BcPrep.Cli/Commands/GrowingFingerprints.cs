using System.Security.Cryptography;
using BcPrep.Writing;

namespace BcPrep.Cli.Commands;

/// <summary>
/// SHA-256 of log files a logger is still writing, kept up as they grow: each call hashes only the bytes added since
/// the previous one, so fingerprinting the day so far at every finished point costs the new rows, not the day.
/// </summary>
internal sealed class GrowingFingerprints : IDisposable
{
    private readonly Dictionary<string, (IncrementalHash Hash, long Bytes)> _files = new(StringComparer.Ordinal);

    /// <summary>The fingerprints of <paramref name="files"/>, the last one taken up to <paramref name="lastFileBytes"/>.</summary>
    public IReadOnlyList<InputFingerprint> Of(IReadOnlyList<string> files, long lastFileBytes)
    {
        var result = new List<InputFingerprint>();
        for (var i = 0; i < files.Count; i++)
        {
            var path = files[i];
            if (!_files.TryGetValue(path, out var state))
            {
                state = (IncrementalHash.CreateHash(HashAlgorithmName.SHA256), 0L);
            }
            try
            {
                using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete, bufferSize: 0);
                var limit = i == files.Count - 1 ? lastFileBytes : stream.Length;
                stream.Seek(state.Bytes, SeekOrigin.Begin);
                var buffer = new byte[1 << 20];
                while (state.Bytes < limit)
                {
                    var read = stream.Read(buffer, 0, (int)Math.Min(buffer.Length, limit - state.Bytes));
                    if (read == 0)
                    {
                        break;
                    }
                    state.Hash.AppendData(buffer, 0, read);
                    state.Bytes += read;
                }
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                throw new BcPrepFailure(FailureKind.InputData, new SourceLocation(path), "cannot read: " + e.Message);
            }
            _files[path] = state;
            result.Add(new InputFingerprint(path, state.Bytes, Convert.ToHexStringLower(state.Hash.GetCurrentHash())));
        }
        return result;
    }

    public void Dispose()
    {
        foreach (var (hash, _) in _files.Values)
        {
            hash.Dispose();
        }
    }
}
