using System.Net;
using EventReview.Core.Records;
using EventReview.Dossier;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Integrity;

/// <summary>The record key and the witness as the app shows them: the public key endpoint, the Integrity page, the verified demo.</summary>
public sealed class RecordKeepingTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private IRecordKeyRing Keys => app.Services.GetRequiredService<IRecordKeyRing>();

    [Fact]
    public async Task The_public_key_is_published_without_sign_in_and_checks_a_downloaded_dossier()
    {
        using var answer = await app.Anonymous().GetAsync("/api/signing-key");

        Assert.Equal(HttpStatusCode.OK, answer.StatusCode);
        var json = await answer.JsonAsync();
        Assert.Equal(Keys.Current!.KeyId, (string?)json["current"]);
        var key = json["keys"]!.AsArray().Single()!;
        Assert.Equal("ECDSA-P256-SHA256", (string?)key["algorithm"]);
        Assert.StartsWith("-----BEGIN PUBLIC KEY-----", (string?)key["publicKeyPem"], StringComparison.Ordinal);
        Assert.DoesNotContain("PRIVATE", json.ToJsonString(), StringComparison.Ordinal);

        var file = Path.Combine(Path.GetTempPath(), "er-signing-key-" + Guid.NewGuid().ToString("N") + ".json");
        await File.WriteAllTextAsync(file, json.ToJsonString());
        try
        {
            var client = await app.As(Who.Observer);
            var zip = await client.GetByteArrayAsync($"/cases/{await client.CaseIdAsync("ER-C-0142")}/dossier.zip");
            var v = await DossierArchive.VerifyAsync(new MemoryStream(zip), Data.Records.PublicKeyFile.Read(file));
            Assert.True(v.Valid, string.Join("\n", v.Problems) + " " + v.Signature);
        }
        finally
        {
            File.Delete(file);
        }
    }

    [Fact]
    public async Task The_integrity_page_shows_the_key_fingerprint_and_the_witness_with_its_warning()
    {
        var html = await (await app.As(Who.Coordinator)).GetStringAsync("/integrity");

        Assert.Contains(RecordKeyFingerprint.Short(Keys.Current!.KeyId), html, StringComparison.Ordinal);
        Assert.Contains("record-heads.jsonl", html, StringComparison.Ordinal);
        Assert.Contains("The witness is inside the data folder", html, StringComparison.Ordinal);
        Assert.Contains("-----BEGIN PUBLIC KEY-----", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_seeded_demo_verifies_whole_and_its_flagship_case_has_a_freeze_and_two_sign_offs()
    {
        var (cases, database) = await app.Services.GetRequiredService<Data.IntegrityVerifier>().VerifyAsync();

        Assert.Empty(database);
        Assert.All(cases, c => Assert.True(c.Valid, c.CandidateId + ": " + string.Join("; ", c.Problems.Select(p => p.What))));
        await using var db = app.Db();
        var flagship = db.Cases.Single(c => c.CandidateId == "ER-C-0142").Id;
        Assert.True(db.ConfigurationSnapshots.Any(s => s.ReviewCaseId == flagship && s.IsFrozen));
        Assert.True(db.SignOffs.Count(s => db.Items.Any(i => i.Id == s.ChecklistItemId && i.ReviewCaseId == flagship)) >= 2);
    }
}
