namespace BcPrep.Tests.Reading;

/// <summary>A scratch folder per test, removed afterwards.</summary>
internal sealed class TempFiles : IDisposable
{
    public TempFiles()
    {
        Root = Path.Combine(Path.GetTempPath(), "bcprep-tests-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Root);
    }

    public string Root { get; }

    public string Write(string name, string text, bool bom = false)
    {
        var path = Path.Combine(Root, name);
        File.WriteAllText(path, text, new System.Text.UTF8Encoding(bom));
        return path;
    }

    public string WriteBytes(string name, byte[] bytes)
    {
        var path = Path.Combine(Root, name);
        File.WriteAllBytes(path, bytes);
        return path;
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(Root, true);
        }
        catch (IOException)
        {
        }
    }
}
