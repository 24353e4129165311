using EventReview.Core.Evidence;
using EventReview.Core.Evidence.Roles;
using EventReview.Core.Tests.Builders;

namespace EventReview.Core.Tests.Evidence.Roles;

public class FileRoleTests
{
    [Theory]
    [InlineData("strain:KP", FileRoleKind.Strain, "KP")]
    [InlineData(" Strain:kp ", FileRoleKind.Strain, "KP")]
    [InlineData("dq-segments", FileRoleKind.DataQualitySegments, null)]
    [InlineData("search-triggers:AB", FileRoleKind.SearchTriggers, "AB")]
    [InlineData("strain", FileRoleKind.Strain, null)]
    [InlineData("blind-record", FileRoleKind.BlindInjectionRecord, null)]
    public void A_role_word_reads_back_to_its_kind_and_site(string word, FileRoleKind kind, string? site)
    {
        var role = FileRole.Parse(word);

        Assert.Equal(kind, role.Kind);
        Assert.Equal(site, role.Site);
        Assert.Equal(role, FileRole.Parse(role.Word));
    }

    [Fact]
    public void Every_kind_has_its_own_stored_word_and_round_trips()
    {
        var words = FileRole.Kinds.Select(FileRole.KindWord).ToList();

        Assert.Equal(words.Count, words.Distinct().Count());
        Assert.All(FileRole.Kinds, k => Assert.Equal(k, FileRole.Parse(FileRole.KindWord(k)).Kind));
        Assert.All(words, w => Assert.True(w.Length + 9 <= FileRole.MaxWordLength));
    }

    [Theory]
    [InlineData("strains", "is not a file role")]
    [InlineData("dq-segments:KP", "does not belong to one site")]
    [InlineData("strain:K-P", "is not a site code")]
    [InlineData("strain:ABCDEFGHI", "is not a site code")]
    [InlineData("", "is required")]
    public void A_malformed_role_is_refused_naming_the_field(string word, string message)
    {
        var ex = Assert.Throws<ArgumentException>(() => FileRole.Parse(word));

        Assert.Equal("role", ex.ParamName);
        Assert.Contains(message, ex.Message, StringComparison.Ordinal);
        Assert.Null(FileRole.TryParse(word));
    }

    [Fact]
    public void A_role_says_in_plain_words_what_it_is()
    {
        Assert.Equal("strain of site KP", new FileRole(FileRoleKind.Strain, "KP").Title);
        Assert.Equal("data-quality segments", new FileRole(FileRoleKind.DataQualitySegments).Title);
    }

    [Fact]
    public void A_role_serves_its_own_site_or_an_unstated_one_but_never_another_site()
    {
        var kp = new FileRole(FileRoleKind.Strain, "KP");

        Assert.True(kp.Serves(FileRoleKind.Strain, "KP"));
        Assert.True(kp.Serves(FileRoleKind.Strain));
        Assert.False(kp.Serves(FileRoleKind.Strain, "AB"));
        Assert.False(kp.Serves(FileRoleKind.SensorSeries, "KP"));
        Assert.True(new FileRole(FileRoleKind.Strain).Serves(FileRoleKind.Strain, "AB"));
    }

    [Fact]
    public void An_attachment_without_a_role_keeps_the_version_1_seal_so_older_rows_still_verify()
    {
        var a = EvidenceItem.Attachment("x.txt", "text/plain", 3, new string('a', 64), "d", People.ReviewerA, Clock.T0);

        // The version 1 canonical form written out by hand (EvidenceItem.Seal's documented fields, in order).
        var v1 = Hashing.Sha256Hex(string.Join('\n', "eventreview-evidence-row-v1", "Attachment", new string('a', 64), "x.txt", "3", "",
            People.ReviewerA.UserId, People.ReviewerA.DisplayName, Clock.T0.UtcTicks.ToString(System.Globalization.CultureInfo.InvariantCulture)));
        Assert.Null(a.Role);
        Assert.Equal(v1, a.Seal());
    }

    [Fact]
    public void The_role_is_sealed_with_the_row_so_a_changed_role_no_longer_matches()
    {
        EvidenceItem Row(FileRole? role) => EvidenceItem.Attachment("x.txt", "text/plain", 3, new string('a', 64), "d", People.ReviewerA, Clock.T0, role);

        var kp = Row(new FileRole(FileRoleKind.Strain, "KP"));

        Assert.Equal("strain:KP", kp.Role);
        Assert.Equal(new FileRole(FileRoleKind.Strain, "KP"), kp.FileRole);
        Assert.NotEqual(Row(null).Seal(), kp.Seal());
        Assert.NotEqual(Row(new FileRole(FileRoleKind.Strain, "AB")).Seal(), kp.Seal());
        Assert.Equal(Row(new FileRole(FileRoleKind.Strain, "KP")).Seal(), kp.Seal());
    }
}
