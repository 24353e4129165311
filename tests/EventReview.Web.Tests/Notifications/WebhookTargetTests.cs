using System.Net;
using EventReview.Web.Notifications;

namespace EventReview.Web.Tests.Notifications;

public sealed class WebhookTargetTests
{
    [Theory]
    [InlineData("127.0.0.1", true)] // loopback
    [InlineData("10.20.30.40", true)] // RFC 1918 10/8
    [InlineData("172.16.0.1", true)] // RFC 1918 172.16/12
    [InlineData("172.31.255.255", true)]
    [InlineData("172.32.0.1", false)] // just outside 172.16/12
    [InlineData("192.168.1.1", true)] // RFC 1918 192.168/16
    [InlineData("100.64.0.1", true)] // RFC 6598 shared address space 100.64/10
    [InlineData("100.128.0.1", false)] // just outside 100.64/10
    [InlineData("169.254.169.254", true)] // RFC 3927 link-local (cloud metadata services live here)
    [InlineData("0.0.0.0", true)]
    [InlineData("192.0.2.10", false)] // RFC 5737 documentation range: public as far as routing goes
    [InlineData("::1", true)]
    [InlineData("fd12:3456:789a::1", true)] // RFC 4193 unique local fc00::/7
    [InlineData("fe80::1", true)] // link-local
    [InlineData("::ffff:10.0.0.1", true)] // IPv4-mapped private
    [InlineData("2001:db8::1", false)] // RFC 3849 documentation prefix
    public void Private_and_local_addresses_are_recognised(string address, bool isPrivate) =>
        Assert.Equal(isPrivate, WebhookTarget.IsPrivate(IPAddress.Parse(address)));

    [Fact]
    public void Addresses_are_checked_against_the_server_rules()
    {
        var strict = new WebhookOptions();
        Assert.Null(WebhookTarget.Problem("https://hooks.example.org/eventreview", strict));
        Assert.Null(WebhookTarget.Problem(null, strict));
        Assert.Contains("must use https", WebhookTarget.Problem("http://hooks.example.org/x", strict), StringComparison.Ordinal);
        Assert.Contains("private network", WebhookTarget.Problem("https://10.0.0.5/x", strict), StringComparison.Ordinal);
        Assert.Contains("private network", WebhookTarget.Problem("https://localhost:8443/x", strict), StringComparison.Ordinal);
        Assert.Contains("without a user name or password", WebhookTarget.Problem("https://user:pw@hooks.example.org/x", strict), StringComparison.Ordinal);
        Assert.Contains("switched off", WebhookTarget.Problem("https://hooks.example.org/x", new WebhookOptions { Enabled = false }), StringComparison.Ordinal);
        Assert.Null(WebhookTarget.Problem("http://127.0.0.1:9000/x", new WebhookOptions { RequireHttps = false, AllowPrivateAddresses = true }));
    }

    [Fact]
    public async Task A_name_that_resolves_to_this_machine_is_refused_when_connecting()
    {
        // The name passes the check when saved (it is not an address); the connection step refuses what it resolves to.
        var connect = WebhookTarget.Connect(allowPrivate: false);
        using var handler = new SocketsHttpHandler { ConnectCallback = connect };
        using var client = new HttpClient(handler);

        var ex = await Assert.ThrowsAsync<HttpRequestException>(() => client.GetAsync("http://localhost:9/x"));

        Assert.Contains("resolves only to addresses on this machine or a private network", ex.ToString(), StringComparison.Ordinal);
    }
}
