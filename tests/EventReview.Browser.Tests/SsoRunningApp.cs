using System.Net;
using System.Net.Sockets;
using EventReview.Web.Tests.Fixtures;

namespace EventReview.Browser.Tests;

/// <summary>
/// The app (demo seeded) with single sign-on at a <see cref="TestIdentityProvider"/> in this process, and
/// notifications whose SMTP server is not reachable (so the profile page shows a message being retried).
/// </summary>
public sealed class SsoRunningApp : RunningApp
{
    public const string ProviderName = "Test Collaboration Login";

    public TestIdentityProvider Provider { get; private set; } = default!;

    /// <summary>A reviewer known only to the provider (group gw-reviewers).</summary>
    public ProviderPerson Reviewer { get; private set; } = default!;

    protected override async Task BeforeStartAsync()
    {
        Provider = await TestIdentityProvider.StartAsync($"{BaseUrl}/signin-oidc");
        Reviewer = Provider.Add("rita", "rita.reviewer@collab.example.org", "Rita Reviewer", "gw-members", "gw-reviewers");
        Settings["EventReview__SignIn__SingleSignOn__Authority"] = Provider.BaseUrl;
        Settings["EventReview__SignIn__SingleSignOn__ClientId"] = TestIdentityProvider.ClientId;
        Settings["EventReview__SignIn__SingleSignOn__ClientSecret"] = TestIdentityProvider.ClientSecret;
        Settings["EventReview__SignIn__SingleSignOn__RequireHttps"] = "false";
        Settings["EventReview__SignIn__SingleSignOn__DisplayName"] = ProviderName;
        Settings["EventReview__SignIn__SingleSignOn__RoleMap__coordinator"] = "gw-review-coordinators";
        Settings["EventReview__SignIn__SingleSignOn__RoleMap__reviewer"] = "gw-reviewers";
        Settings["EventReview__SignIn__SingleSignOn__RoleMap__observer"] = "gw-members";
        Settings["EventReview__Notifications__PollSeconds"] = "1";
        Settings["EventReview__Notifications__BaseUrl"] = BaseUrl;
        Settings["EventReview__Notifications__Smtp__Host"] = "127.0.0.1";
        Settings["EventReview__Notifications__Smtp__Port"] = ClosedPort().ToString(System.Globalization.CultureInfo.InvariantCulture);
        Settings["EventReview__Notifications__Smtp__Security"] = "None";
        Settings["EventReview__Notifications__Smtp__From"] = "review-noreply@example.org";
    }

    protected override async Task AfterStopAsync() => await Provider.DisposeAsync();

    private static int ClosedPort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
