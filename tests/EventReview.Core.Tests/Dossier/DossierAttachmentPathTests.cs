using EventReview.Core.Dossier;

namespace EventReview.Core.Tests.Dossier;

public class DossierAttachmentPathTests
{
    private static (SampleCase Sample, DossierDocument Doc) Build()
    {
        var s = SampleCase.Build();
        return (s, DossierBuilder.Build(s.Case, s.Sites, s.Snapshots));
    }

    private static Dictionary<string, byte[]> FilesOf(SampleCase s, DossierDocument doc) =>
        DossierFiles.From(doc, new Dictionary<string, byte[]> { [s.AttachmentSha256] = SampleCase.AttachmentBytes });

    private static DossierDocument WithAttachmentPath(DossierDocument doc, string schema, string path) => doc with
    {
        SchemaVersion = schema,
        Items = doc.Items.Select(i => i with { Evidence = i.Evidence.Select(e => e.AttachmentPath is null ? e : e with { AttachmentPath = path }).ToList() }).ToList(),
    };

    [Fact]
    public void A_schema_3_dossier_names_the_attachment_by_hash_and_safe_name_and_verifies()
    {
        var (s, doc) = Build();
        var files = FilesOf(s, doc);
        Assert.Contains(s.AttachmentPath, files.Keys);
        var v = DossierFiles.Verify(files);
        Assert.True(v.Valid, string.Join("\n", v.Problems));
    }

    [Fact]
    public void A_schema_2_dossier_with_hash_only_names_still_verifies()
    {
        var (s, doc) = Build();
        var old = WithAttachmentPath(doc, DossierDocument.Version2SchemaVersion, "attachments/" + s.AttachmentSha256);
        var v = DossierFiles.Verify(FilesOf(s, old));
        Assert.True(v.Valid, string.Join("\n", v.Problems));
    }

    [Fact]
    public void An_attachment_path_that_does_not_follow_its_schema_is_reported()
    {
        // A renamed entry (for example one pointing outside the folder) is not accepted just because its bytes hash right.
        var (s, doc) = Build();
        var moved = WithAttachmentPath(doc, DossierDocument.CurrentSchemaVersion, "attachments/../" + s.AttachmentSha256);
        var v = DossierFiles.Verify(FilesOf(s, moved));
        Assert.False(v.Valid);
        Assert.Contains(v.Problems, p => p.What.Contains("attachment path is 'attachments/../", StringComparison.Ordinal));
    }
}
