namespace BcPrep;
/// <summary>Input data or configuration that cannot be turned into a trustworthy number.</summary>
public class BcPrepDataException : Exception
{
    public BcPrepDataException(string message) : base(message) { }
    public BcPrepDataException(string message, Exception inner) : base(message, inner) { }
}
