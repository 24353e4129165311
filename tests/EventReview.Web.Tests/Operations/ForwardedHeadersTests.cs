using System.Net;
using EventReview.Web.Operations;
using EventReview.Web.Tests.Fixtures;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.HttpOverrides;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Operations;

/// <summary>
/// Forwarded headers are believed only from configured proxies, never from loopback by default (any program on the
/// machine could otherwise claim HTTPS and any client address). The "HTTPS needed" page, like every answer, carries
/// the security headers.
/// </summary>
public sealed class ForwardedHeadersTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    /// <summary>The app as a team server (HTTPS required), every request arriving from 127.0.0.1, with the given proxies.</summary>
    private WebApplicationFactory<Program> FromLoopback(params string[] trustedProxies) => app.WithWebHostBuilder(b =>
    {
        b.UseSetting("EventReview:Operations:RequireHttps", "true");
        for (var i = 0; i < trustedProxies.Length; i++)
        {
            b.UseSetting($"EventReview:Operations:TrustedProxies:{i}", trustedProxies[i]);
        }

        b.ConfigureServices(s => s.AddSingleton<IStartupFilter>(new LoopbackPeer()));
    });

    private static async Task<HttpResponseMessage> ViaProxyAsync(WebApplicationFactory<Program> factory, string path)
    {
        var client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        using var request = new HttpRequestMessage(HttpMethod.Get, path);
        request.Headers.Add("X-Forwarded-Proto", "https");
        request.Headers.Add("X-Forwarded-For", "203.0.113.7");
        return await client.SendAsync(request);
    }

    [Fact]
    public void By_default_no_proxy_is_trusted_not_even_loopback()
    {
        var o = new ForwardedHeadersOptions();
        Assert.NotEmpty(o.KnownProxies); // the framework's own default trusts loopback

        OperationsSetup.ConfigureProxies(o, []);

        // Both lists empty would make the framework believe every sender; no forwarded header is read at all instead.
        Assert.Empty(o.KnownProxies);
        Assert.Empty(o.KnownIPNetworks);
        Assert.Equal(ForwardedHeaders.None, o.ForwardedHeaders);
    }

    [Fact]
    public void Configured_proxies_and_networks_are_trusted()
    {
        var o = new ForwardedHeadersOptions();

        OperationsSetup.ConfigureProxies(o, ["127.0.0.1", "10.0.0.0/8", " "]);

        Assert.Equal(ForwardedHeaders.XForwardedFor | ForwardedHeaders.XForwardedProto, o.ForwardedHeaders);
        Assert.Equal([IPAddress.Loopback], o.KnownProxies);
        Assert.Equal("10.0.0.0/8", Assert.Single(o.KnownIPNetworks).ToString());
        Assert.Throws<ArgumentException>(() => OperationsSetup.ConfigureProxies(new ForwardedHeadersOptions(), ["proxy.example"]));
        Assert.Throws<ArgumentException>(() => OperationsSetup.ConfigureProxies(new ForwardedHeadersOptions(), ["10.0.0.0/99"]));
    }

    [Fact]
    public async Task A_forwarded_https_from_loopback_is_ignored_unless_loopback_is_listed()
    {
        await using var unlisted = FromLoopback();
        using var ignored = await ViaProxyAsync(unlisted, "/signin");

        Assert.Equal(HttpStatusCode.BadRequest, ignored.StatusCode);
        Assert.Contains("must be reached over HTTPS", await ignored.Content.ReadAsStringAsync(), StringComparison.Ordinal);

        await using var listed = FromLoopback("127.0.0.1");
        using var believed = await ViaProxyAsync(listed, "/signin");

        Assert.Equal(HttpStatusCode.OK, believed.StatusCode);
    }

    [Fact]
    public async Task The_https_needed_page_carries_the_security_headers()
    {
        await using var server = FromLoopback();
        using var response = await server.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false }).GetAsync("/cases");

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Equal("DENY", response.Headers.GetValues("X-Frame-Options").Single());
        Assert.Equal("nosniff", response.Headers.GetValues("X-Content-Type-Options").Single());
        Assert.Equal("same-origin", response.Headers.GetValues("Referrer-Policy").Single());
        Assert.Contains("frame-ancestors 'none'", response.Headers.GetValues("Content-Security-Policy").Single(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("/api/no-such-thing", 404)]
    [InlineData("/files/not-a-hash", 404)]
    [InlineData("/api/cases/1/notes", 404)]
    public async Task Error_answers_carry_the_security_headers_and_a_problem_body(string path, int status)
    {
        using var response = await (await app.As(Who.Observer)).GetAsync(path);

        Assert.Equal(status, (int)response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        Assert.Equal("DENY", response.Headers.GetValues("X-Frame-Options").Single());
        Assert.Equal("nosniff", response.Headers.GetValues("X-Content-Type-Options").Single());
    }

    /// <summary>Makes every in-memory request look as if it came over a loopback connection (as from nginx on the same host).</summary>
    private sealed class LoopbackPeer : IStartupFilter
    {
        public Action<IApplicationBuilder> Configure(Action<IApplicationBuilder> next) => builder =>
        {
            builder.Use((context, nextMiddleware) =>
            {
                context.Connection.RemoteIpAddress = IPAddress.Loopback;
                return nextMiddleware(context);
            });
            next(builder);
        };
    }
}
