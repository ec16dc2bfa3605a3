using System.Security.Cryptography;
using BcPrep.Writing;

namespace BcPrep.Cli;

/// <summary>
/// The SHA-256 of one file, hashed a chunk at a time: in the background by threads at the lowest priority
/// (<see cref="EarlyFingerprints"/>), and, when the fingerprint is needed, by the thread that needs it, at its own
/// priority. Once that thread asks (<see cref="Finish"/>), the background threads stop after the chunk they are
/// hashing: a low-priority thread holding the hash while a busy machine starves it would make the asking thread wait
/// for it chunk after chunk (measured: the 8 h day took 91 s instead of 50 s under a load average of 10). The same
/// bytes in the same order as <see cref="LogArguments.Fingerprint"/>, so the same fingerprint, named
/// <paramref name="displayName"/>.
/// </summary>
internal sealed class ChunkedFingerprint(string displayName, string path)
{
    /// <summary>One read: 256 kB, so that the asking thread waits for at most a fraction of a millisecond of hashing.</summary>
    private const int ChunkBytes = 1 << 18;

    private readonly Lock _gate = new();
    private volatile bool _asked;
    private FileStream? _stream;
    private IncrementalHash? _sha;
    private byte[]? _buffer;
    private bool _done;
    private InputFingerprint? _result;

    /// <summary>Hashes the next chunk in the background; false once the file is hashed, could not be read, or is asked for.</summary>
    public bool Advance() => !_asked && Step();

    /// <summary>
    /// Hashes what is left on the calling thread (the background stops after its current chunk); the fingerprint, or
    /// null when the file could not be read.
    /// </summary>
    public InputFingerprint? Finish()
    {
        _asked = true;
        while (Step())
        {
        }
        return _result;
    }

    private bool Step()
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
                _result = new InputFingerprint(displayName, _stream.Length, Convert.ToHexStringLower(_sha.GetHashAndReset()));
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                // Left to LogArguments.Fingerprint, which reports it in its usual words.
            }
            Close();
            return false;
        }
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
