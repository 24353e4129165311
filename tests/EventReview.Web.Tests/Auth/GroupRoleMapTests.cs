using EventReview.Web.Auth;

namespace EventReview.Web.Tests.Auth;

public sealed class GroupRoleMapTests
{
    private static SingleSignOnSettings Settings(string? defaultRole = null) => new()
    {
        Authority = "https://login.example.org/realms/collab",
        ClientId = "eventreview",
        ClientSecret = "s",
        RoleMap = new(StringComparer.OrdinalIgnoreCase)
        {
            ["coordinator"] = "gw-review-coordinators",
            ["Reviewer"] = "gw-reviewers, gw-instrument-checks",
            ["observer"] = "gw-members",
        },
        DefaultRole = defaultRole,
    };

    [Theory]
    [InlineData(new[] { "gw-members" }, "observer")]
    [InlineData(new[] { "gw-members", "gw-instrument-checks" }, "reviewer")]
    [InlineData(new[] { "gw-instrument-checks", "gw-review-coordinators", "gw-members" }, "coordinator")]
    [InlineData(new[] { "GW-MEMBERS" }, null)]
    [InlineData(new string[0], null)]
    public void The_highest_role_of_the_groups_wins_and_names_compare_exactly(string[] groups, string? expected) =>
        Assert.Equal(expected, Settings().Map().RoleFor(groups));

    [Fact]
    public void A_default_role_covers_people_in_no_mapped_group()
    {
        var map = Settings("observer").Map();

        Assert.Equal("observer", map.RoleFor(["unrelated"]));
        Assert.Empty(map.GroupsGiving("observer", ["unrelated"]));
        Assert.Equal(["gw-instrument-checks"], map.GroupsGiving("reviewer", ["unrelated", "gw-instrument-checks"]));
    }

    [Fact]
    public void Settings_that_are_right_have_no_problems_and_single_sign_on_off_needs_nothing()
    {
        Assert.Empty(Settings().Problems());
        Assert.Empty(new SingleSignOnSettings().Problems());
        Assert.Empty(new SignInSettings().Problems());
    }

    [Fact]
    public void Half_set_up_single_sign_on_is_a_problem()
    {
        var problems = new SingleSignOnSettings { ClientId = "eventreview" }.Problems();

        Assert.Contains(problems, p => p.StartsWith("EventReview:SignIn:SingleSignOn:Authority is empty but other single sign-on settings are set", StringComparison.Ordinal));
    }

    [Fact]
    public void A_role_map_with_no_group_or_no_map_at_all_is_a_problem()
    {
        var s = Settings();
        s.RoleMap["observer"] = " ";
        Assert.Contains(s.Problems(), p => p.Contains("RoleMap:observer names no group", StringComparison.Ordinal));

        s.RoleMap.Clear();
        Assert.Contains(s.Problems(), p => p.Contains("RoleMap is empty and there is no DefaultRole", StringComparison.Ordinal));
    }
}
