using System.Net;
using Microsoft.AspNetCore.Mvc.Testing;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>
/// A browser for two sites: the app under test (in memory) and the <see cref="TestIdentityProvider"/> (on a local
/// port). It follows redirects between them with a cookie jar per site, and fills the provider's login form.
/// </summary>
public sealed class SsoBrowser : IDisposable
{
    private readonly HttpClient _app;
    private readonly HttpClient _provider;
    private readonly TestIdentityProvider _idp;

    public SsoBrowser(WebApplicationFactory<Program> factory, TestIdentityProvider idp)
    {
        _idp = idp;
        _app = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, HandleCookies = true });
        _provider = new HttpClient(new HttpClientHandler { AllowAutoRedirect = false, UseCookies = true, CookieContainer = new CookieContainer() });
    }

    /// <summary>The client for the app (it holds the app's cookies).</summary>
    public HttpClient App => _app;

    /// <summary>Where the last page came from.</summary>
    public Uri Location { get; private set; } = new("http://localhost/");

    /// <summary>Gets <paramref name="url"/> and follows redirects; returns the last answer (a page, or an error).</summary>
    public async Task<HttpResponseMessage> GoAsync(string url)
    {
        var target = new Uri(Location, url);
        for (var hops = 0; hops < 20; hops++)
        {
            Location = target;
            var client = target.GetLeftPart(UriPartial.Authority) + "/" == _idp.BaseUrl ? _provider : _app;
            var response = await client.GetAsync(client == _app ? target.PathAndQuery : target.ToString());
            if ((int)response.StatusCode is < 300 or >= 400 || response.Headers.Location is null)
            {
                return response;
            }

            target = new Uri(target, response.Headers.Location);
        }

        throw new InvalidOperationException($"More than 20 redirects from {url}.");
    }

    /// <summary>True when the last page is the provider's login form.</summary>
    public bool AtProviderLogin => Location.AbsolutePath == "/login" && Location.GetLeftPart(UriPartial.Authority) + "/" == _idp.BaseUrl;

    /// <summary>Fills the provider's login form (the last page) as <paramref name="person"/> and follows on.</summary>
    public async Task<HttpResponseMessage> LogInAtProviderAsync(ProviderPerson person)
    {
        if (!AtProviderLogin)
        {
            throw new InvalidOperationException($"Not at the provider's login form but at {Location}.");
        }

        var returnUrl = System.Web.HttpUtility.ParseQueryString(Location.Query)["returnUrl"] ?? "/";
        var post = await _provider.PostAsync(new Uri(Location, "/login"), new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["username"] = person.UserName,
            ["password"] = person.Password,
            ["returnUrl"] = returnUrl,
        }));
        Assert.Equal(HttpStatusCode.Redirect, post.StatusCode);
        return await GoAsync(new Uri(Location, post.Headers.Location!).ToString());
    }

    /// <summary>Single sign-on from the app's sign-in page: start, log in at the provider when asked, come back.</summary>
    public async Task<HttpResponseMessage> SignInAsync(ProviderPerson person, string returnUrl = "/cases")
    {
        var page = await GoAsync("/account/sso?returnUrl=" + Uri.EscapeDataString(returnUrl));
        return AtProviderLogin ? await LogInAtProviderAsync(person) : page;
    }

    /// <summary>The value of the <c>error</c> query parameter of the page the browser is on, or null.</summary>
    public string? ErrorCode => System.Web.HttpUtility.ParseQueryString(Location.Query)["error"];

    public void Dispose()
    {
        _app.Dispose();
        _provider.Dispose();
    }
}
