using System.Security.Cryptography;
using System.Text;
using EventReview.Core.Cases;
using EventReview.Core.Configuration;

namespace EventReview.Core.Tests.Configuration;

public class ConfigurationSnapshotTests
{
    private static readonly Actor Coordinator = new("u1", "Ada Quill");
    private static readonly DateTimeOffset T = new(2031, 1, 2, 3, 4, 5, TimeSpan.Zero);

    private static ConfigurationSnapshot Capture(Dictionary<string, string> items) =>
        ConfigurationSnapshot.Capture("kx", "before", items, Coordinator, T);

    [Fact]
    public void Capture_normalises_site_code_and_stores_sorted_canonical_items()
    {
        var s = Capture(new() { ["b"] = "2", ["a"] = "é\"1" });

        Assert.Equal("KX", s.SiteCode);
        Assert.Equal("{\"a\":\"é\\\"1\",\"b\":\"2\"}", s.ItemsJson);
        Assert.Equal(["a", "b"], s.Items.Keys.ToArray());
        Assert.False(s.IsFrozen);
        Assert.Null(s.Fingerprint);
    }

    [Fact]
    public void Freeze_sets_the_fingerprint_of_the_documented_canonical_text()
    {
        var s = Capture(new() { ["fw"] = "1=2\nx", ["cal"] = "v3" });

        s.Freeze(7, T.AddHours(-1), T.AddDays(1), "Candidate\nreview", Coordinator, T.AddMinutes(1));

        // Oracle: the text written out by hand from docs/formats/configuration-fingerprint.md.
        var text = "eventreview-configuration-v1\nsite=KX\nlabel=before\nfreeze-from=2031-01-02T02:04:05.0000000Z\n" +
                   "freeze-until=2031-01-03T03:04:05.0000000Z\nreason=Candidate\\nreview\nitems=2\ncal=v3\nfw=1\\=2\\nx\n";
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text))), s.Fingerprint);
        Assert.True(s.IsFrozen);
        Assert.Equal(7, s.ReviewCaseId);
        Assert.True(s.InFreezePeriod(T));
        Assert.False(s.InFreezePeriod(T.AddDays(2)));
    }

    [Fact]
    public void A_frozen_record_whose_items_were_changed_afterwards_no_longer_matches_its_fingerprint()
    {
        var s = Capture(new() { ["fw"] = "1" });
        Assert.False(s.FingerprintMatches()); // not frozen
        s.Freeze(7, T.AddHours(-1), T.AddDays(1), "review", Coordinator, T);
        Assert.True(s.FingerprintMatches());

        // What an intruder editing the stored row does (the class itself offers no way): the items change, the fingerprint stays.
        typeof(ConfigurationSnapshot).GetProperty(nameof(ConfigurationSnapshot.ItemsJson))!.SetValue(s, "{\"fw\":\"2\"}");
        typeof(ConfigurationSnapshot).GetField("_items", System.Reflection.BindingFlags.NonPublic | System.Reflection.BindingFlags.Instance)!.SetValue(s, null);

        Assert.False(s.FingerprintMatches());
    }

    [Fact]
    public void Escaping_keeps_a_value_with_a_newline_from_posing_as_two_items()
    {
        var one = Capture(new() { ["a"] = "1\nb=2" });
        var two = Capture(new() { ["a"] = "1", ["b"] = "2" });
        one.Freeze(1, T, T.AddDays(1), "r", Coordinator, T);
        two.Freeze(1, T, T.AddDays(1), "r", Coordinator, T);

        Assert.NotEqual(one.Fingerprint, two.Fingerprint);
    }

    [Fact]
    public void Freeze_refuses_a_second_freeze_a_bad_period_and_an_empty_reason()
    {
        var s = Capture(new() { ["a"] = "1" });
        Assert.Equal("freeze-period", Assert.Throws<DomainRuleException>(() => s.Freeze(1, T, T, "r", Coordinator, T)).Rule);
        Assert.Equal("reason-required", Assert.Throws<DomainRuleException>(() => s.Freeze(1, T, T.AddDays(1), "  ", Coordinator, T)).Rule);
        Assert.False(s.IsFrozen);

        s.Freeze(1, T, T.AddDays(1), "r", Coordinator, T);
        var fingerprint = s.Fingerprint;

        Assert.Equal("already-frozen", Assert.Throws<DomainRuleException>(() => s.Freeze(1, T, T.AddDays(2), "again", Coordinator, T)).Rule);
        Assert.Equal(fingerprint, s.Fingerprint);
        Assert.Equal(T.AddDays(1), s.FreezeUntil);
    }

    [Fact]
    public void Capture_rejects_bad_site_codes_and_keys()
    {
        Assert.Throws<ArgumentException>(() => ConfigurationSnapshot.Capture("K 1", "x", new Dictionary<string, string>(), Coordinator, T));
        Assert.Throws<ArgumentException>(() => Capture(new() { ["a b"] = "1" }));
        Assert.Throws<ArgumentException>(() => Capture(new() { ["a"] = new string('x', 10_001) }));
    }
}
