using PdfSharp.Fonts;

namespace EventReview.Dossier;

/// <summary>
/// Font resolver for PDFsharp on Linux: every family resolves to DejaVu Sans (regular or bold) from the
/// <c>fonts-dejavu-core</c> package, so PDFs look the same on every machine. Italic requests use the upright face.
/// </summary>
public sealed class DejaVuFontResolver : IFontResolver
{
    /// <summary>Family name to use in <c>XFont</c>.</summary>
    public const string FamilyName = "DejaVu Sans";

    private const string Regular = "DejaVuSans";
    private const string Bold = "DejaVuSans-Bold";

    private static readonly string[] Folders = ["/usr/share/fonts/truetype/dejavu", "/usr/share/fonts/dejavu", "/usr/local/share/fonts/dejavu"];
    private static readonly object Gate = new();

    /// <summary>Installs this resolver as PDFsharp's global resolver once per process (later calls do nothing).</summary>
    public static void EnsureInstalled()
    {
        lock (Gate)
        {
            if (GlobalFontSettings.FontResolver is not DejaVuFontResolver)
            {
                GlobalFontSettings.FontResolver = new DejaVuFontResolver();
            }
        }
    }

    /// <inheritdoc />
    public FontResolverInfo? ResolveTypeface(string familyName, bool bold, bool italic) =>
        new(bold ? Bold : Regular);

    /// <inheritdoc />
    public byte[]? GetFont(string faceName)
    {
        var file = faceName + ".ttf";
        foreach (var folder in Folders)
        {
            var path = Path.Combine(folder, file);
            if (File.Exists(path))
            {
                return File.ReadAllBytes(path);
            }
        }

        throw new FileNotFoundException($"Font '{file}' not found in {string.Join(", ", Folders)}; install the fonts-dejavu-core package.", file);
    }
}
