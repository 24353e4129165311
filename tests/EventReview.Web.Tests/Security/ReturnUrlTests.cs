using System.Net;
using EventReview.Data.Auth;
using EventReview.Web.Security;
using EventReview.Web.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Security;

/// <summary>The sign-in form's return address: only a path of this app, checked before the password.</summary>
public sealed class ReturnUrlTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    [Theory]
    [InlineData("/cases/3/items/timing.arrival", "/cases/3/items/timing.arrival")]
    [InlineData("/cases?state=open&q=ER-C", "/cases?state=open&q=ER-C")]
    [InlineData("/", "/")]
    [InlineData("/\t/evil.example", "/cases")]
    [InlineData("//evil.example", "/cases")]
    [InlineData("/\\evil.example", "/cases")]
    [InlineData("/\r\n/evil.example", "/cases")]
    [InlineData("/\u202E/evil.example", "/cases")]
    [InlineData("https://evil.example/", "/cases")]
    [InlineData("evil.example", "/cases")]
    [InlineData(" /cases", "/cases")]
    [InlineData("", "/cases")]
    [InlineData(null, "/cases")]
    public void Only_a_path_of_the_app_is_kept(string? url, string kept)
    {
        Assert.Equal(kept, ReturnUrls.Safe(url));
    }

    [Fact]
    public void A_return_address_longer_than_the_limit_is_dropped()
    {
        Assert.Equal("/cases", ReturnUrls.Safe("/" + new string('a', ReturnUrls.MaxLength)));
        Assert.Equal("/" + new string('a', ReturnUrls.MaxLength - 1), ReturnUrls.Safe("/" + new string('a', ReturnUrls.MaxLength - 1)));
    }

    [Fact]
    public async Task Signing_in_with_a_tab_hidden_return_address_lands_on_the_cases_and_is_audited_once()
    {
        // The reported case: a browser drops the tab, so "/\t/evil.example" would lead to //evil.example; it answered 500
        // after writing a "signed in" audit entry.
        var email = $"ret-{Guid.NewGuid():N}"[..12] + "@demo.invalid";
        using (var scope = app.Services.CreateScope())
        {
            await scope.ServiceProvider.GetRequiredService<AccountAdmin>().CreateUserAsync(email, Roles.Observer, "Return-Address-Passphrase-8", null);
        }

        var client = app.Anonymous();
        using var response = await client.PostAsync("/account/signin", new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["__RequestVerificationToken"] = await EventReviewFactory.AntiforgeryTokenAsync(client),
            ["email"] = email,
            ["password"] = "Return-Address-Passphrase-8",
            ["returnUrl"] = "/\t/evil.example",
        }));

        Assert.Equal(HttpStatusCode.Redirect, response.StatusCode);
        Assert.Equal("/cases", response.Headers.Location?.OriginalString);
        await using var db = app.Db();
        Assert.Equal([AccountEventKinds.SignInSucceeded], await db.AccountEvents.Where(e => e.Account == email && e.Kind != AccountEventKinds.AccountCreated).Select(e => e.Kind).ToListAsync());
    }

    [Fact]
    public async Task An_overlong_password_is_refused_without_hashing_it_and_the_page_says_why()
    {
        var client = app.Anonymous();
        using var response = await client.PostAsync("/account/signin", new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["__RequestVerificationToken"] = await EventReviewFactory.AntiforgeryTokenAsync(client),
            ["email"] = EventReviewFactory.AccountFor(Who.Observer).Email,
            ["password"] = new string('p', 200_000),
            ["returnUrl"] = "/cases",
        }));

        Assert.Equal(HttpStatusCode.Redirect, response.StatusCode);
        var page = await client.GetStringAsync(response.Headers.Location!.OriginalString);
        Assert.Contains("That email or password is too long", page, StringComparison.Ordinal);
    }
}
