using System.Text.RegularExpressions;

namespace EventReview.Core.Tests.Repository;

/// <summary>
/// Scans the tracked files of src, tests, docs, checklists, benchmarks and the README for names, labels, colours and numbers that belong to
/// existing programs of this trade or to one famous analysis (issue 16). Every pattern is written so that this file does not
/// match it (a one-character class such as <c>S[E]I</c> breaks the literal), and each rule proves it can fail on an example.
/// </summary>
public class OriginalityScanTests
{
    private const RegexOptions Plain = RegexOptions.CultureInvariant;
    private const RegexOptions AnyCase = RegexOptions.CultureInvariant | RegexOptions.IgnoreCase;
    private static readonly string[] Everywhere = ["src/", "tests/", "docs/", "checklists/", "README.md", "benchmarks/"];
    private static readonly string[] Tests = ["tests/", "benchmarks/"];

    private static readonly OriginalityRule[] Rules =
    [
        new("channel names written site, colon, subsystem, hyphen, name", new Regex(@"[A-Z0-9]{2}[:][A-Z]{3,}-", Plain), Everywhere, [], "AB" + ":" + "MAG" + "-VAULT-X"),
        new("subsystem tokens of a real channel convention", new Regex(@"\b(?:S[E]I|M[A]G|M[I]C|P[W]R|W[I]ND)-[A-Z]", Plain), Everywhere, [], "SE" + "I-FLOOR-Z"),
        new("upper-case data-quality flag names of an existing program", new Regex(@"\b(?:C[A]L-LINE-OFF|H[I]GH-WIND)\b", Plain), Everywhere, [], "HIGH" + "-WIND"),
        new("a site location word of a real observatory", new Regex(@"c[o]rner[- ]station", AnyCase), Everywhere, [], "corner" + " station floor"),
        new("default colours of a plotting library", new Regex(@"#(?:1[f]77b4|f[f]7f0e|2[c]a02c|d[6]2728|9[4]67bd|8[c]564b|e[3]77c2|7[f]7f7f|b[c]bd22|1[7]becf)\b", AnyCase),
            Everywhere, [], "#1f77" + "b4"),
        new("date-coded candidate ids of a real alert scheme (ours are ER-C-nnnn)", new Regex(@"\b[C]\d{2}-\d{4}[A-Z]\b", Plain), Everywhere, [], "C31" + "-0314A"),
        new("a class label of a known glitch taxonomy", new Regex(@"\bb[l]ips?\b", AnyCase), Everywhere, [], "suspected " + "bl" + "ip glitch"),
        new("a collaboration's run numbering", new Regex(@"o[b]serving\s+period\s+\d", AnyCase), Everywhere, [], "observing " + "period 3"),
        new("the name of the body that decides, as a famous talk put it", new Regex(@"d[e]tection\s+committee", AnyCase), Everywhere, [], "detection" + "\ncommittee"),
        new("the legacy chain verdict words outside the legacy verdict table and fixtures", new Regex(@"\b(?:n[o]thing|s[o]mething)\s+added\b", AnyCase), Everywhere,
            ["src/EventReview.Core/Verdicts/VerdictWords.cs", "tests/EventReview.Web.Tests/Checks/Legacy/"], "no" + "thing added"),
        new("letter+digit site codes in test networks", new Regex(@"(?<!ToString\()[""'][A-Z][0-9][""'=,]|\\n[A-Z][0-9],", Plain), Tests, [], "\"M" + "2\""),
        new("the band of one famous analysis", new Regex(@"\b3[0]\s*(?:-|–|,|to)\s*350\b", AnyCase), Everywhere, [], "30" + "-350 Hz"),
        new("the network SNR of one famous detection", new Regex(@"network\s+SNR\s+(?:of\s+)?2[4]\b|NetworkSnr:\s*2[4]\b", AnyCase), Everywhere, [], "network SNR " + "24"),
        new("the mains frequency of one famous analysis", new Regex(@"\b6[0]\s*Hz\s+mains|mains[^.\n]{0,30}\b6[0]\s*Hz", AnyCase), Everywhere, [], "60" + " Hz mains"),
        new("the delay of one famous detection", new Regex(@"(?<![\d.])(?:6\.9|7|7\.0|7\.1)\s*ms\b", Plain), Everywhere, [], "delay is 7" + " ms"),
    ];

    public static TheoryData<string> RuleNames()
    {
        var data = new TheoryData<string>();
        foreach (var r in Rules)
        {
            data.Add(r.Name);
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(RuleNames))]
    public void No_tracked_file_holds_what_the_rule_refuses(string name)
    {
        var rule = Rules.Single(r => r.Name == name);
        Assert.Matches(rule.Pattern, rule.Example); // the rule can fail

        var hits = TrackedFiles.Read("src", "tests", "docs", "checklists", "README.md", "benchmarks")
            .Where(f => rule.Scans(f.Path))
            .SelectMany(f => rule.Pattern.Matches(f.Text).Select(m => $"{f.Path}:{Line(f.Text, m.Index)}: {m.Value.ReplaceLineEndings(" ")}"))
            .ToList();

        Assert.True(hits.Count == 0, $"{rule.Name}:\n" + string.Join("\n", hits.Take(20)));
    }

    [Fact]
    public void The_scan_reads_this_file_and_its_patterns_do_not_match_it()
    {
        var self = TrackedFiles.Read("tests").SingleOrDefault(f => f.Path.EndsWith("Repository/OriginalityScanTests.cs", StringComparison.Ordinal));

        // Before the file is committed git does not list it; then read it from disk so the check still runs.
        var text = self.Text ?? File.ReadAllText(Path.Combine(TrackedFiles.Root, "tests/EventReview.Core.Tests/Repository/OriginalityScanTests.cs"));
        Assert.Contains("OriginalityRule", text, StringComparison.Ordinal);
        Assert.All(Rules, r => Assert.DoesNotMatch(r.Pattern, text));
    }

    [Fact]
    public void Core_pictures_take_every_colour_from_the_palette()
    {
        // A colour literal (#rgb, #rrggbb) or a colour keyword in a fill/stroke attribute anywhere in Core but the palette.
        var colour = new Regex(@"#[0-9a-fA-F]{6}\b|#[0-9a-fA-F]{3}\b|(?:fill|stroke)=\\?""(?!none\\?"")[a-z]+\\?""", Plain);
        Assert.Matches(colour, "stroke=\\\"bl" + "ack\\\"");
        var hits = TrackedFiles.Read("src/EventReview.Core")
            .Where(f => f.Path.EndsWith(".cs", StringComparison.Ordinal) && !f.Path.EndsWith("/Plots/PlotPalette.cs", StringComparison.Ordinal))
            .SelectMany(f => colour.Matches(f.Text).Select(m => $"{f.Path}:{Line(f.Text, m.Index)}: {m.Value}"))
            .ToList();

        Assert.True(hits.Count == 0, "colours outside PlotPalette:\n" + string.Join("\n", hits));
    }

    private static int Line(string text, int index) => 1 + text.AsSpan(0, index).Count('\n');
}
