namespace BcPrep.Rig;

/// <summary>
/// The words the rig file uses for one kind of choice, and the typed value each word stands for. The loader checks a
/// word against <see cref="Words"/> and turns it into its value once; whoever shows a choice back to a person (a
/// message, a report) takes the word from <see cref="WordOf"/>, so a spelling lives in one place.
/// </summary>
public sealed class RigSpelling<T>
    where T : struct, Enum
{
    private readonly (string Word, T Value)[] _pairs;

    /// <param name="pairs">Every allowed word with its value, in the order a message lists them.</param>
    public RigSpelling(params (string Word, T Value)[] pairs)
    {
        _pairs = pairs;
        Words = [.. pairs.Select(p => p.Word)];
    }

    /// <summary>The allowed words, in the order a message lists them.</summary>
    public IReadOnlyList<string> Words { get; }

    /// <summary>The value of an allowed word.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The word is not allowed (the loader checks words first).</exception>
    public T ValueOf(string word)
    {
        foreach (var (w, value) in _pairs)
        {
            if (string.Equals(w, word, StringComparison.Ordinal))
            {
                return value;
            }
        }
        throw new ArgumentOutOfRangeException(nameof(word), word, $"not a rig-file word for {typeof(T).Name}");
    }

    /// <summary>The rig-file word for a value.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value has no rig-file word.</exception>
    public string WordOf(T value)
    {
        foreach (var (word, v) in _pairs)
        {
            if (EqualityComparer<T>.Default.Equals(v, value))
            {
                return word;
            }
        }
        throw new ArgumentOutOfRangeException(nameof(value), value, "no rig-file word for this value");
    }
}
