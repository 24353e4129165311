using Microsoft.AspNetCore.Hosting;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>
/// The app with single sign-on at a <see cref="TestIdentityProvider"/> started with it (the demo's local accounts
/// stay on unless <see cref="LocalAccounts"/> is false). Groups: <c>gw-review-coordinators</c> give coordinator,
/// <c>gw-reviewers</c> reviewer, <c>gw-members</c> observer.
/// </summary>
public class SingleSignOnFactory : EventReviewFactory
{
    public const string ProviderName = "Test Collaboration Login";

    private TestIdentityProvider? _provider;

    public TestIdentityProvider Provider => _provider ?? throw new InvalidOperationException("Not started.");

    /// <summary>Whether the password form is on (set before the first request).</summary>
    public bool LocalAccounts { get; init; } = true;

    /// <summary>Overrides the provider address (e.g. a port where nothing answers).</summary>
    public string? AuthorityOverride { get; init; }

    protected override async Task StartAsync()
    {
        _provider = await TestIdentityProvider.StartAsync("http://localhost/signin-oidc");
        await base.StartAsync();
    }

    protected override async Task StopAsync()
    {
        await base.StopAsync();
        if (_provider is not null)
        {
            await _provider.DisposeAsync();
        }
    }

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        base.ConfigureWebHost(builder);
        builder.UseSetting("EventReview:SignIn:LocalAccounts", LocalAccounts ? "true" : "false");
        builder.UseSetting("EventReview:SignIn:SingleSignOn:Authority", AuthorityOverride ?? Provider.BaseUrl);
        builder.UseSetting("EventReview:SignIn:SingleSignOn:ClientId", TestIdentityProvider.ClientId);
        builder.UseSetting("EventReview:SignIn:SingleSignOn:ClientSecret", TestIdentityProvider.ClientSecret);
        builder.UseSetting("EventReview:SignIn:SingleSignOn:RequireHttps", "false");
        builder.UseSetting("EventReview:SignIn:SingleSignOn:DisplayName", ProviderName);
        builder.UseSetting("EventReview:SignIn:SingleSignOn:RoleMap:coordinator", "gw-review-coordinators");
        builder.UseSetting("EventReview:SignIn:SingleSignOn:RoleMap:reviewer", "gw-reviewers, gw-instrument-checks");
        builder.UseSetting("EventReview:SignIn:SingleSignOn:RoleMap:observer", "gw-members");
    }
}
