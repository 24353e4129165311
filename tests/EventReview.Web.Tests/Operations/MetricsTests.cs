using System.Net;
using EventReview.Web.Operations;
using EventReview.Web.Tests.Fixtures;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Operations;

/// <summary>
/// <c>/metrics</c> answers in the Prometheus text format (through OpenTelemetry's exporter) to the configured client
/// addresses only: loopback by default, everyone else gets 403 with a problem body.
/// </summary>
public sealed class MetricsTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private const string PeerHeader = "X-Test-Peer";

    /// <summary>The app with every request arriving from the address in <see cref="PeerHeader"/> (as Kestrel would report it).</summary>
    private WebApplicationFactory<Program> WithPeers(params string[] metricsClients) => app.WithWebHostBuilder(b =>
    {
        for (var i = 0; i < metricsClients.Length; i++)
        {
            b.UseSetting($"EventReview:Telemetry:MetricsClients:{i}", metricsClients[i]);
        }

        b.ConfigureServices(s => s.AddSingleton<IStartupFilter>(new PeerFromHeader()));
    });

    private static HttpClient From(WebApplicationFactory<Program> factory, string peer)
    {
        var client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        client.DefaultRequestHeaders.Add(PeerHeader, peer);
        return client;
    }

    [Fact]
    public async Task Metrics_from_loopback_list_the_writers_histogram_requests_and_sign_ins_after_a_write()
    {
        await using var factory = WithPeers();
        var token = await app.TokenClientAsync("metrics test");
        var writer = From(factory, "127.0.0.1");
        writer.DefaultRequestHeaders.Authorization = token.DefaultRequestHeaders.Authorization;
        using (var opened = await writer.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId())))
        {
            Assert.Equal(HttpStatusCode.Created, opened.StatusCode);
        }

        var browser = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, HandleCookies = true });
        browser.DefaultRequestHeaders.Add(PeerHeader, "127.0.0.1");
        using (await EventReviewFactory.PostSignInAsync(browser, "nobody@example.org", "not the password"))
        {
        }

        using var response = await From(factory, "::ffff:127.0.0.1").GetAsync("/metrics");
        var text = await response.Content.ReadAsStringAsync();

        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.StartsWith("text/plain", response.Content.Headers.ContentType?.MediaType, StringComparison.Ordinal);
        Assert.Contains("eventreview_writes_batch_size_bucket{", text, StringComparison.Ordinal);
        Assert.Contains("eventreview_writes_wait_duration_milliseconds_count", text, StringComparison.Ordinal);
        Assert.Contains("http_server_request_duration_seconds_count{", text, StringComparison.Ordinal);
        Assert.Contains("http_route=\"/api/cases\"", text, StringComparison.Ordinal);
        Assert.Contains("eventreview_sign_ins_total{", text, StringComparison.Ordinal);
        Assert.Contains("result=\"failed\"", text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("203.0.113.7")]
    [InlineData("10.1.2.3")]
    public async Task Metrics_from_an_address_not_listed_are_refused_with_a_problem(string peer)
    {
        await using var factory = WithPeers("192.0.2.0/24");

        using var refused = await From(factory, peer).GetAsync("/metrics");
        using var loopback = await From(factory, "127.0.0.1").GetAsync("/metrics");
        using var listed = await From(factory, "192.0.2.9").GetAsync("/metrics");

        Assert.Equal(HttpStatusCode.Forbidden, refused.StatusCode);
        Assert.Equal("application/problem+json", refused.Content.Headers.ContentType?.MediaType);
        var problem = await refused.JsonAsync();
        Assert.Contains(peer, (string?)problem["detail"], StringComparison.Ordinal);
        Assert.DoesNotContain("eventreview_", problem.ToJsonString(), StringComparison.Ordinal);

        // Once a list is configured, loopback is no longer allowed by default.
        Assert.Equal(HttpStatusCode.Forbidden, loopback.StatusCode);
        Assert.Equal(HttpStatusCode.OK, listed.StatusCode);
    }

    [Fact]
    public async Task Metrics_through_a_proxy_that_is_not_trusted_are_refused_even_from_loopback()
    {
        await using var factory = WithPeers();
        var client = From(factory, "127.0.0.1");
        client.DefaultRequestHeaders.Add("X-Forwarded-For", "203.0.113.7");

        using var refused = await client.GetAsync("/metrics");

        Assert.Equal(HttpStatusCode.Forbidden, refused.StatusCode);
        Assert.Contains("TrustedProxies", (string?)(await refused.JsonAsync())["detail"], StringComparison.Ordinal);
    }

    [Fact]
    public void Client_list_defaults_to_loopback_and_names_a_bad_entry()
    {
        var loopbackOnly = TelemetrySetup.ParseClients([]);
        Assert.True(loopbackOnly.Allows(IPAddress.Loopback));
        Assert.True(loopbackOnly.Allows(IPAddress.IPv6Loopback));
        Assert.False(loopbackOnly.Allows(IPAddress.Parse("192.168.1.10")));
        Assert.False(loopbackOnly.Allows(null));

        var error = Assert.Throws<ArgumentException>(() => TelemetrySetup.ParseClients(["prometheus.example"]));
        Assert.Contains("'prometheus.example'", error.Message, StringComparison.Ordinal);
    }

    private sealed class PeerFromHeader : IStartupFilter
    {
        public Action<IApplicationBuilder> Configure(Action<IApplicationBuilder> next) => builder =>
        {
            builder.Use((context, nextMiddleware) =>
            {
                if (IPAddress.TryParse(context.Request.Headers[PeerHeader].ToString(), out var peer))
                {
                    context.Connection.RemoteIpAddress = peer;
                }

                return nextMiddleware(context);
            });
            next(builder);
        };
    }
}
