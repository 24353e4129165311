namespace EventReview.TestSupport;

/// <summary>A fresh folder under the system temp folder, deleted on dispose.</summary>
public sealed class TempFolder : IDisposable
{
    public TempFolder(string prefix = "er-test")
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), $"{prefix}-{Guid.NewGuid():N}");
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public void Dispose()
    {
        try
        {
            Directory.Delete(Path, recursive: true);
        }
        catch (IOException)
        {
            // A file still open by a pooled connection; the system temp cleaner gets it later.
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}
