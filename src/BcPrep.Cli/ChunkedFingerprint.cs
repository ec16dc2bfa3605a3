using System.Security.Cryptography;
using BcPrep.Writing;

namespace BcPrep.Cli;

/// <summary>
/// The SHA-256 of one file, hashed a chunk at a time by whichever thread asks: the early hashing thread
/// (<see cref="EarlyFingerprints"/>), which runs at the lowest priority, and the thread that needs the fingerprint,
/// which finishes what is left at its own priority, so that a busy machine that starves the first never makes the
/// second wait for it longer than one chunk. The same bytes in the same order as <see cref="LogArguments.Fingerprint"/>,
/// so the same fingerprint.
/// </summary>
internal sealed class ChunkedFingerprint(string path)
{
    /// <summary>One read: 1 MB, as <see cref="LogArguments.Fingerprint"/> reads (a system call a chunk).</summary>
    private const int ChunkBytes = 1 << 20;

    private readonly Lock _gate = new();
    private FileStream? _stream;
    private IncrementalHash? _sha;
    private byte[]? _buffer;
    private bool _done;
    private InputFingerprint? _result;

    /// <summary>Hashes the next chunk; false once the file is hashed or could not be read.</summary>
    public bool Advance()
    {
        lock (_gate)
        {
            if (_done)
            {
                return false;
            }
            try
            {
                _stream ??= new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 0);
                _sha ??= IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
                _buffer ??= new byte[ChunkBytes];
                var read = _stream.Read(_buffer);
                if (read > 0)
                {
                    _sha.AppendData(_buffer, 0, read);
                    return true;
                }
                _result = new InputFingerprint(path, _stream.Length, Convert.ToHexStringLower(_sha.GetHashAndReset()));
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                // Left to LogArguments.Fingerprint, which reports it in its usual words.
            }
            Close();
            return false;
        }
    }

    /// <summary>Hashes what is left on the calling thread; the fingerprint, or null when the file could not be read.</summary>
    public InputFingerprint? Finish()
    {
        while (Advance())
        {
        }
        return _result;
    }

    private void Close()
    {
        _done = true;
        _stream?.Dispose();
        _sha?.Dispose();
        _stream = null;
        _sha = null;
        _buffer = null;
    }
}
