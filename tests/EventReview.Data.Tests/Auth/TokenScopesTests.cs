using EventReview.Data.Auth;

namespace EventReview.Data.Tests.Auth;

public sealed class TokenScopesTests
{
    [Fact]
    public void No_scopes_means_the_pipeline_set_of_open_and_add_evidence() =>
        Assert.Equal([TokenScopes.CasesOpen, TokenScopes.EvidenceAdd], TokenScopes.Parse(null));

    [Fact]
    public void Scopes_may_be_repeated_comma_separated_or_mixed_case_and_come_back_in_a_fixed_order() =>
        Assert.Equal(TokenScopes.All, TokenScopes.Parse(["EVIDENCE:add,cases:read", "cases:open", "cases:read"]));

    [Fact]
    public void An_unknown_scope_is_refused_by_name()
    {
        var ex = Assert.Throws<ArgumentException>(() => TokenScopes.Parse(["cases:sign"]));

        Assert.Contains("'cases:sign'", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_stored_word_that_is_not_a_scope_grants_nothing() =>
        Assert.Equal([TokenScopes.CasesOpen], TokenScopes.Split("cases:open admin network:edit"));

    [Theory]
    [InlineData(0)]
    [InlineData(367)]
    public void A_lifetime_outside_one_day_to_a_year_is_refused(int days) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => ApiToken.Create("p", "tests", DateTimeOffset.UnixEpoch, null, days));

    [Fact]
    public void A_new_token_expires_after_ninety_days_by_default_and_revoked_wins_over_expired()
    {
        var now = new DateTimeOffset(2026, 1, 1, 0, 0, 0, TimeSpan.Zero);
        var (token, secret) = ApiToken.Create("p", "tests", now);

        Assert.StartsWith(ApiToken.Prefix, secret, StringComparison.Ordinal);
        Assert.Equal(now.AddDays(90), token.ExpiresAt);
        Assert.Equal(TokenState.Active, token.StateAt(now));
        token.Revoke(now.AddDays(1));
        Assert.Equal(TokenState.Revoked, token.StateAt(now.AddDays(200)));
    }

    [Theory]
    [InlineData("search A\u202E")]
    [InlineData("\u200Bsearch A")]
    [InlineData("search\u0007A")]
    public void A_token_name_with_a_hidden_or_reordering_character_is_refused(string name) =>
        Assert.Equal("name", Assert.Throws<ArgumentException>(() => ApiToken.Create(name, "tests", DateTimeOffset.UnixEpoch)).ParamName);
}
