using EventReview.Core.Inputs;
namespace EventReview.Web.Services.Checks;

/// <summary>Reads a check's input files from the case's attachments, with errors that name the file and its role.</summary>
public static class CheckInputs
{
    /// <summary>The attachment with this hash, or an error asking to pick the file.</summary>
    /// <exception cref="ArgumentException">When no file is picked or the hash is not attached to the case.</exception>
    public static CaseFiles.CaseFile Find(IReadOnlyList<CaseFiles.CaseFile> files, string? sha, string role)
    {
        if (string.IsNullOrWhiteSpace(sha))
        {
            throw new ArgumentException($"Pick the {role} file (attach it to an item of this case first).", role);
        }

        return files.FirstOrDefault(f => f.Sha256 == sha)
            ?? throw new ArgumentException($"The {role} file {sha[..Math.Min(12, sha.Length)]} is not attached to this case.", role);
    }

    /// <summary>Parses an attached text file; a parse error becomes a <see cref="FormatException"/> naming the file.</summary>
    /// <exception cref="FormatException">"role file 'name': line N ...".</exception>
    public static async Task<(T Value, CheckFileRef File)> ReadTextAsync<T>(CaseFiles store, IReadOnlyList<CaseFiles.CaseFile> files, string? sha, string role,
        Func<TextReader, T> parse, CancellationToken ct)
    {
        var file = Find(files, sha, role);
        var text = await store.ReadTextAsync(file.Sha256, ct);
        try
        {
            using var reader = new StringReader(text);
            return (parse(reader), new CheckFileRef(role, file.FileName, file.Sha256));
        }
        catch (FormatException ex)
        {
            throw new FormatException($"{Capitalise(role)} file '{file.FileName}': {ex.Message}", ex);
        }
        catch (ArgumentException ex)
        {
            throw new FormatException($"{Capitalise(role)} file '{file.FileName}': {UserMessage.From(ex)}", ex);
        }
    }

    private static string Capitalise(string s) => s.Length == 0 ? s : char.ToUpperInvariant(s[0]) + s[1..];
}
