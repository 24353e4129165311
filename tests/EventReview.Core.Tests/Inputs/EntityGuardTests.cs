using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Inputs;
using EventReview.Core.Network;
using EventReview.Core.Tests.Builders;
using EventReview.Core.Tests.Cases;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Inputs;

/// <summary>
/// The entities refuse poison values themselves, whoever calls them (API, pages, command line, demo seed), so that no
/// stored value can break a later read. A refused change leaves the case exactly as it was.
/// </summary>
public class EntityGuardTests
{
    private static readonly GpsTime T = GpsTime.FromSeconds(1_400_000_000.25m);

    [Theory]
    [InlineData(1e308)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(double.NaN)]
    [InlineData(-0.5)]
    [InlineData(10_000.5)]
    public void An_arrival_refuses_an_snr_outside_0_to_10000(double snr)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new CaseArrival("KX", T, snr));

        Assert.Equal("snr", ex.ParamName);
        Assert.Contains("site KX", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void The_snr_that_was_finite_yet_poisoned_the_network_snr_is_refused_while_the_largest_allowed_keeps_it_finite()
    {
        // Adversarial: "finite" alone lets 1e308 in, and its square overflows, so the network SNR (root sum of squares)
        // of a stored case became infinity and every later read of the case failed.
        Assert.True(double.IsFinite(1e308));
        Assert.True(double.IsPositiveInfinity(Math.Sqrt((1e308 * 1e308) + (9.5 * 9.5))));
        Assert.Throws<ArgumentOutOfRangeException>(() => new CaseArrival("KX", T, 1e308));

        var c = new CaseBuilder().WithoutArrivals()
            .WithArrival("KX", 0, InputLimits.MaxSnr).WithArrival("MV", 0.001, InputLimits.MaxSnr).WithArrival("TQ", 0.002, InputLimits.MaxSnr).Build();

        Assert.Equal(InputLimits.MaxSnr * Math.Sqrt(3), c.NetworkSnr, 1e-9);
    }

    [Theory]
    [InlineData("")]
    [InlineData("K X")]
    [InlineData("K\u202EX")]
    [InlineData("TOOLONGCODE")]
    public void An_arrival_refuses_a_site_code_that_is_not_1_to_8_letters_or_digits(string code)
    {
        Assert.Equal("site", Assert.Throws<ArgumentOutOfRangeException>(() => new CaseArrival(code, T, 8)).ParamName);
    }

    [Fact]
    public void An_arrival_refuses_a_time_outside_the_gps_range()
    {
        Assert.Equal("gpsTime", Assert.Throws<ArgumentOutOfRangeException>(() => new CaseArrival("KX", GpsTime.Epoch, 8)).ParamName);
        Assert.Equal("gpsTime", Assert.Throws<ArgumentOutOfRangeException>(() => new CaseArrival("KX", GpsRange.Latest.AddSeconds(1), 8)).ParamName);
    }

    [Theory]
    [InlineData("TC-\u202E1000", "candidateId")]
    [InlineData("TC-\u20660001\u2069", "candidateId")]
    [InlineData("TC-\uFEFF", "candidateId")]
    public void A_case_refuses_a_candidate_id_with_hidden_characters(string id, string field)
    {
        Assert.Equal(field, Assert.Throws<ArgumentException>(() => new CaseBuilder().WithCandidateId(id).Build()).ParamName);
    }

    [Fact]
    public void A_case_refuses_a_candidate_id_of_129_characters_and_keeps_one_of_128()
    {
        Assert.Equal(128, new CaseBuilder().WithCandidateId(new string('C', 128)).Build().CandidateId.Length);
        Assert.Equal("candidateId", Assert.Throws<ArgumentException>(() => new CaseBuilder().WithCandidateId(new string('C', 129)).Build()).ParamName);
    }

    [Fact]
    public void A_case_refuses_a_time_beyond_the_horizon_or_at_the_epoch()
    {
        var late = new CaseBuilder().WithoutArrivals().AtGps(GpsRange.Latest);
        Assert.Equal("gpsTime", Assert.Throws<ArgumentOutOfRangeException>(() => late.Build()).ParamName);
        Assert.Equal("gpsTime", Assert.Throws<ArgumentOutOfRangeException>(() => new CaseBuilder().WithoutArrivals().AtGps(GpsTime.Epoch).Build()).ParamName);
    }

    [Fact]
    public void An_attachment_refuses_a_long_description_or_content_type_before_anything_is_made()
    {
        var sha = new string('a', 64);
        var description = Assert.Throws<ArgumentException>(() => EvidenceItem.Attachment("a.txt", "text/plain", 3, sha, new string('d', 5 * 1024 * 1024), People.ReviewerA, Clock.T0));
        Assert.Equal("description", description.ParamName);
        Assert.Contains("at most 2,000 characters", description.Message, StringComparison.Ordinal);

        Assert.Equal("contentType", Assert.Throws<ArgumentException>(() => EvidenceItem.CheckAttachmentFields("text/" + new string('x', 300), "ok")).ParamName);
        Assert.Equal("contentType", Assert.Throws<ArgumentException>(() => EvidenceItem.CheckAttachmentFields("text/pl\u202Eain", "ok")).ParamName);
        Assert.Equal("sizeBytes", Assert.Throws<ArgumentOutOfRangeException>(() => EvidenceItem.Attachment("a.txt", "text/plain", -1, sha, "", People.ReviewerA, Clock.T0)).ParamName);
        Assert.Equal(2000, EvidenceItem.Attachment("a.txt", "text/plain", 3, sha, new string('d', 2000), People.ReviewerA, Clock.T0).Text.Length);
    }

    [Fact]
    public void A_link_refuses_an_overlong_url_or_title()
    {
        Assert.Equal("url", Assert.Throws<ArgumentException>(() => EvidenceItem.Link("https://example.org/" + new string('p', 2100), "t", People.ReviewerA, Clock.T0)).ParamName);
        Assert.Equal("title", Assert.Throws<ArgumentException>(() => EvidenceItem.Link("https://example.org/", new string('t', 501), People.ReviewerA, Clock.T0)).ParamName);
    }

    [Fact]
    public void A_sign_off_statement_over_4000_characters_is_refused_and_the_case_is_unchanged()
    {
        var c = new CaseBuilder().Build();
        c.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(1));
        var before = CaseSnapshot.Of(c);

        var ex = Assert.Throws<ArgumentException>(() => c.SignNow("alpha.one", People.ReviewerB, Clock.At(2), new string('s', 4001)));

        Assert.Equal("statement", ex.ParamName);
        Assert.Equal(before, CaseSnapshot.Of(c));
        Assert.NotNull(c.SignNow("alpha.one", People.ReviewerB, Clock.At(2), new string('s', 4000)));
    }

    [Fact]
    public void Closing_with_an_overlong_statement_or_an_unknown_outcome_is_refused_and_the_case_is_unchanged()
    {
        var c = new CaseBuilder().Build();
        c.SignEverything(Clock.At(1));
        var before = CaseSnapshot.Of(c);

        Assert.Equal("statement", Assert.Throws<ArgumentException>(() => c.Close(CaseOutcome.Instrumental, new string('s', 4001), People.Coordinator, Clock.At(2))).ParamName);
        Assert.Equal("outcome", Assert.Throws<ArgumentOutOfRangeException>(() => c.Close((CaseOutcome)99, "Decided.", People.Coordinator, Clock.At(2))).ParamName);
        Assert.Equal(before, CaseSnapshot.Of(c));
    }

    [Fact]
    public void A_site_refuses_an_overlong_or_hidden_name_and_a_network_its_name()
    {
        Assert.Equal("name", Assert.Throws<ArgumentException>(() => new Site("KX", new string('n', 121), 10, 20, 0, 0, 90, 1e-4)).ParamName);
        Assert.Equal("name", Assert.Throws<ArgumentException>(() => new Site("KX", "Site\u202EXK", 10, 20, 0, 0, 90, 1e-4)).ParamName);
        Assert.Equal("name", Assert.Throws<ArgumentException>(() => new DetectorNetwork("Net\u200B")).ParamName);
    }
}
