using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using EventReview.Core.Evidence;

namespace EventReview.Dossier;

/// <summary>
/// Makes a PDFsharp 6 file reproducible. PDFsharp writes three random values on every save: the six-letter font-subset
/// tags (<c>/BaseFont/ABCDEF+Name</c>), the XMP <c>uuid:</c> document and instance ids, and the trailer <c>/ID</c>.
/// Each is replaced by a value of the same length derived from <c>seed</c>, so no byte offset (cross-reference table,
/// stream lengths) moves. Dates are fixed by the caller through <c>PdfDocument.Info</c>.
/// </summary>
public static partial class PdfStabilizer
{
    /// <summary>Returns a copy of <paramref name="pdf"/> with the random values replaced.</summary>
    public static byte[] Stabilize(byte[] pdf, string seed)
    {
        ArgumentNullException.ThrowIfNull(pdf);
        var text = Encoding.Latin1.GetString(pdf);
        var tags = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (Match m in SubsetTag().Matches(text))
        {
            var old = m.Groups[1].Value;
            if (!tags.ContainsKey(old))
            {
                tags[old] = Tag(tags.Count);
            }
        }

        foreach (var (old, replacement) in tags)
        {
            text = text.Replace(old + "+", replacement + "+", StringComparison.Ordinal);
        }

        var n = 0;
        text = Uuid().Replace(text, _ => "uuid:" + new Guid(Convert.FromHexString(Hashing.Sha256Hex($"{seed}/uuid/{n++}")[..32])).ToString("D"));
        text = TrailerId().Replace(text, m =>
        {
            var id = Hashing.Sha256Hex(seed + "/id")[..32].ToUpperInvariant();
            return $"/ID[<{id}><{id}>]";
        });
        var bytes = Encoding.Latin1.GetBytes(text);
        if (bytes.Length != pdf.Length)
        {
            throw new InvalidOperationException("PDF stabilising changed the file length.");
        }

        return bytes;
    }

    // Subset tags: six upper-case letters, distinct per index (A..Z base 26).
    private static string Tag(int index)
    {
        var chars = new char[6];
        for (var k = 5; k >= 0; k--)
        {
            chars[k] = (char)('A' + (index % 26));
            index /= 26;
        }

        return new string(chars).ToString(CultureInfo.InvariantCulture);
    }

    [GeneratedRegex(@"/(?:BaseFont|FontName)\s*/([A-Z]{6})\+")]
    private static partial Regex SubsetTag();

    [GeneratedRegex(@"uuid:[0-9a-fA-F]{8}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{12}")]
    private static partial Regex Uuid();

    [GeneratedRegex(@"/ID\s*\[\s*<[0-9A-Fa-f]{32}>\s*<[0-9A-Fa-f]{32}>\s*\]")]
    private static partial Regex TrailerId();
}
