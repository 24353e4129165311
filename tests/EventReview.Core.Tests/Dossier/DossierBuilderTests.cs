using EventReview.Core.Cases;
using EventReview.Core.Configuration;
using EventReview.Core.Dossier;

namespace EventReview.Core.Tests.Dossier;

public class DossierBuilderTests
{
    [Fact]
    public void Building_an_unchanged_case_twice_gives_byte_identical_json()
    {
        var s = SampleCase.Build();

        var a = DossierJson.Serialize(DossierBuilder.Build(s.Case, s.Sites, s.Snapshots));
        var b = DossierJson.Serialize(DossierBuilder.Build(s.Case, s.Sites.Reverse().ToList(), s.Snapshots.Reverse().ToList()));

        Assert.Equal(a, b);
    }

    [Fact]
    public void Document_holds_the_case_items_sign_offs_chain_and_only_used_sites()
    {
        var s = SampleCase.Build();

        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);

        Assert.Equal("eventreview-dossier/3", doc.SchemaVersion);
        Assert.Equal(["KX", "MV"], doc.Sites.Select(x => x.Code).ToArray());
        Assert.Equal(["timing.delay", "timing.notes", "config.frozen"], doc.Items.Select(i => i.Key).ToArray());
        Assert.Equal(s.Case.Timeline[^1].Hash, doc.ChainHead);
        Assert.Equal(s.Case.Timeline.Count, doc.Timeline.Count);
        var delay = doc.Items[0];
        Assert.Equal(["note", "attachment", "link"], delay.Evidence.Select(e => e.Kind).ToArray());
        Assert.Equal(s.AttachmentPath, delay.Evidence[1].AttachmentPath);
        Assert.Equal("delays.csv", delay.Evidence[1].FileName);
        Assert.Equal(["pictures/1.svg", "pictures/2.svg"], delay.Computations[0].Pictures);
        Assert.StartsWith("<svg", doc.PictureSvgs["pictures/2.svg"]);
        Assert.Equal("signed off", delay.State);
        Assert.Equal(delay.Fingerprint, delay.SignOffs.Single().EvidenceFingerprint);
        var notes = doc.Items[1];
        Assert.True(notes.SignOffs.Single().IsStale);
        Assert.True(notes.HasStaleSignOffs);
        Assert.NotNull(notes.SignOffs.Single().StaleSinceUtc);
        Assert.Equal("ready for sign-off", notes.State);
    }

    [Fact]
    public void Configurations_carry_the_frozen_fingerprint_and_the_later_drift()
    {
        var s = SampleCase.Build();

        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);

        Assert.Equal(2, doc.Configurations.Count);
        var frozen = doc.Configurations[0];
        var later = doc.Configurations[1];
        Assert.True(frozen.IsFrozen);
        Assert.Equal(s.Snapshots[1].Fingerprint, frozen.Fingerprint);
        Assert.Null(frozen.Drift);
        Assert.Equal(DriftCheck.Concern, later.Drift!.Verdict);
        Assert.Equal([new ConfigurationChange("daq.firmware", "4.2.1", "4.2.2")], later.Drift.Changed);
        Assert.Equal(["filters.sha256"], later.Drift.Added.Select(a => a.Key).ToArray());
        Assert.Equal(["seal.rack3"], later.Drift.Removed.Select(a => a.Key).ToArray());
    }

    [Fact]
    public void Json_is_camel_case_with_the_schema_version_first()
    {
        var s = SampleCase.Build();

        var text = System.Text.Encoding.UTF8.GetString(DossierJson.Serialize(DossierBuilder.Build(s.Case, s.Sites, s.Snapshots)));

        Assert.StartsWith("{\n  \"schemaVersion\": \"eventreview-dossier/3\",", text);
        Assert.Contains("\"chainHead\":", text);
        Assert.DoesNotContain("pictureSvgs", text);
        Assert.DoesNotContain("\r", text);
        Assert.EndsWith("}\n", text);
    }

    [Fact]
    public void Empty_timeline_has_the_genesis_chain_head()
    {
        var s = SampleCase.Build();
        var doc = DossierBuilder.Build(s.Case, [], []);

        Assert.NotEqual(TimelineEntry.GenesisHash, doc.ChainHead);
        Assert.Empty(doc.Sites);
        Assert.Empty(doc.Configurations);
    }
}
