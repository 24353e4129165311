namespace EventReview.Data.Records;

/// <summary>
/// Where the record key and the witness live. Configuration keys <c>EventReview:Records:KeyDirectory</c> (default
/// <c>keys/</c> in the data folder), <c>EventReview:Records:WitnessDirectory</c> (default <c>witness/</c> in the data
/// folder; it should be another machine's mount) and <c>EventReview:Records:WitnessUrl</c> (optional HTTP endpoint that
/// also receives every witness line).
/// </summary>
public sealed record RecordSettings(string KeyDirectory, string WitnessDirectory, string? WitnessUrl = null)
{
    /// <summary>The defaults for a data folder.</summary>
    public static RecordSettings ForDataDirectory(string dataDirectory)
    {
        var dir = Path.GetFullPath(dataDirectory);
        return new RecordSettings(Path.Combine(dir, "keys"), Path.Combine(dir, "witness"));
    }

    /// <summary>Settings from configuration values (null or empty ones take the defaults of <paramref name="dataDirectory"/>).</summary>
    public static RecordSettings From(string? keyDirectory, string? witnessDirectory, string? witnessUrl, string dataDirectory)
    {
        var defaults = ForDataDirectory(dataDirectory);
        return new RecordSettings(
            string.IsNullOrWhiteSpace(keyDirectory) ? defaults.KeyDirectory : Path.GetFullPath(keyDirectory),
            string.IsNullOrWhiteSpace(witnessDirectory) ? defaults.WitnessDirectory : Path.GetFullPath(witnessDirectory),
            string.IsNullOrWhiteSpace(witnessUrl) ? null : witnessUrl.Trim());
    }

    /// <summary>Settings from the environment variables the app reads (<c>EventReview__Records__KeyDirectory</c>, ...), for the command line.</summary>
    public static RecordSettings FromEnvironment(string dataDirectory, string? keyDirectory = null, string? witnessDirectory = null) => From(
        keyDirectory ?? Environment.GetEnvironmentVariable("EventReview__Records__KeyDirectory"),
        witnessDirectory ?? Environment.GetEnvironmentVariable("EventReview__Records__WitnessDirectory"),
        Environment.GetEnvironmentVariable("EventReview__Records__WitnessUrl"),
        dataDirectory);

    /// <summary>True when the witness is inside <paramref name="dataDirectory"/> (then whoever can change the data can change it too).</summary>
    public bool WitnessInside(string dataDirectory) => IsInside(WitnessDirectory, dataDirectory);

    /// <summary>True when the key folder is inside <paramref name="dataDirectory"/>.</summary>
    public bool KeysInside(string dataDirectory) => IsInside(KeyDirectory, dataDirectory);

    private static bool IsInside(string path, string folder)
    {
        var f = Path.GetFullPath(folder).TrimEnd(Path.DirectorySeparatorChar) + Path.DirectorySeparatorChar;
        return (Path.GetFullPath(path).TrimEnd(Path.DirectorySeparatorChar) + Path.DirectorySeparatorChar).StartsWith(f, StringComparison.Ordinal);
    }
}
