using System.Text;
using EventReview.Core.Dossier;

namespace EventReview.Dossier;

/// <summary>
/// Re-renders the human-readable files from <c>dossier.json</c> and compares: <c>index.html</c> byte for byte, and the
/// text <c>summary.pdf</c> shows (<see cref="PdfText"/>), so that neither can say something the data do not. The first
/// difference is named. Rendering needs the same program version (the dossier names its generator) and, for the PDF,
/// the DejaVu fonts.
/// </summary>
public static class DossierRenderingCheck
{
    public const string Html = "index.html";
    public const string Pdf = "summary.pdf";

    /// <summary>Adds a problem for each readable file that does not match its re-rendering.</summary>
    public static void Check(DossierDocument doc, IReadOnlyDictionary<string, byte[]> files, List<DossierProblem> problems)
    {
        ArgumentNullException.ThrowIfNull(doc);
        ArgumentNullException.ThrowIfNull(files);
        ArgumentNullException.ThrowIfNull(problems);
        var pictures = doc.Items.SelectMany(i => i.Computations).SelectMany(c => c.Pictures).Distinct(StringComparer.Ordinal)
            .Where(files.ContainsKey).ToDictionary(p => p, p => Encoding.UTF8.GetString(files[p]), StringComparer.Ordinal);
        var rendered = doc with { PictureSvgs = pictures };
        var version = doc.Generator.Version == DossierBuilder.GeneratorVersion ? string.Empty
            : $" (the dossier was written by {doc.Generator.Name} {doc.Generator.Version}; this is {DossierBuilder.GeneratorVersion})";
        if (files.TryGetValue(Html, out var html))
        {
            var expected = DossierHtml.Render(rendered);
            if (!html.AsSpan().SequenceEqual(expected))
            {
                var (line, shown, should) = FirstDifference(Encoding.UTF8.GetString(expected), Encoding.UTF8.GetString(html));
                problems.Add(new DossierProblem(Html, line, $"shows '{shown}' where dossier.json renders '{should}': it says something the data do not{version}."));
            }
        }

        if (files.TryGetValue(Pdf, out var pdf))
        {
            IReadOnlyList<string> expected;
            try
            {
                expected = PdfText.Extract(DossierPdf.Render(rendered));
            }
            catch (Exception ex) when (ex is FileNotFoundException or InvalidOperationException)
            {
                problems.Add(new DossierProblem(Pdf, null, $"could not be re-rendered here to compare its text ({ex.Message})."));
                return;
            }

            var shown = PdfText.Extract(pdf);
            var at = Enumerable.Range(0, Math.Max(expected.Count, shown.Count)).FirstOrDefault(k => k >= expected.Count || k >= shown.Count || expected[k] != shown[k], -1);
            if (at >= 0)
            {
                var says = at < shown.Count ? $"'{Cut(shown[at])}'" : "nothing more";
                var should = at < expected.Count ? $"'{Cut(expected[at])}'" : "nothing more";
                problems.Add(new DossierProblem(Pdf, $"text {at + 1}", $"shows {says} where dossier.json renders {should}: it says something the data do not{version}."));
            }
        }
    }

    /// <summary>The line of the first difference, and a few words of each text around it.</summary>
    private static (string Line, string Actual, string Expected) FirstDifference(string expected, string actual)
    {
        var n = 0;
        while (n < expected.Length && n < actual.Length && expected[n] == actual[n])
        {
            n++;
        }

        var from = Math.Max(0, n - 24);
        string Around(string s) => Cut(s[Math.Min(from, s.Length)..Math.Min(s.Length, n + 48)]);
        return ($"line {expected.AsSpan(0, n).Count('\n') + 1}", Around(actual), Around(expected));
    }

    private static string Cut(string s)
    {
        s = s.ReplaceLineEndings(" ");
        return s.Length > 160 ? s[..160] + "…" : s;
    }
}
