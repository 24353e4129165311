using EventReview.Data.Auth;
using Microsoft.AspNetCore.Identity;

namespace EventReview.Data.Tests.Auth;

public sealed class PasswordRulesTests
{
    private static readonly AppUser User = new() { Email = "kim.tanaka@demo.invalid", UserName = "kim.tanaka@demo.invalid", DisplayName = "Kim Tanaka Reviewer" };

    private static async Task<IdentityResult> CheckAsync(string password) => await new PasswordRules().ValidateAsync(null!, User, password);

    [Theory]
    [InlineData("Password1234")] // common practice: on the bundled list, whatever the case
    [InlineData("QWERTYUIOPAS")]
    [InlineData("123456789012")]
    public async Task A_very_common_password_is_refused_with_a_plain_reason(string password)
    {
        var result = await CheckAsync(password);

        Assert.False(result.Succeeded);
        Assert.Contains(result.Errors, e => e.Code == "PasswordIsCommon" && e.Description.Contains("very common", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("kim.tanaka@demo.invalid")]
    [InlineData("KIM.TANAKA@DEMO.INVALID")]
    [InlineData("kim.tanaka")]
    [InlineData("Kim Tanaka Reviewer")]
    public async Task The_email_or_the_name_of_the_account_is_refused(string password)
    {
        var result = await CheckAsync(password);

        Assert.Contains(result.Errors, e => e.Code == "PasswordIsPersonal");
    }

    [Theory]
    [InlineData("DemoReviewerA1")]
    [InlineData("correct-Horse-7-battery")]
    public async Task An_unusual_password_passes(string password) => Assert.True((await CheckAsync(password)).Succeeded);

    [Fact]
    public void The_bundled_list_is_loaded_and_has_about_fifty_entries()
    {
        var lines = typeof(PasswordRules).Assembly.GetManifestResourceStream("EventReview.Data.Auth.common-passwords.txt");
        Assert.NotNull(lines);
        using var reader = new StreamReader(lines);
        var entries = reader.ReadToEnd().Split('\n').Select(l => l.Trim()).Where(l => l.Length > 0 && !l.StartsWith('#')).ToList();
        Assert.InRange(entries.Count, 40, 80);
        Assert.All(entries, e => Assert.True(PasswordRules.IsCommon(e.ToUpperInvariant()), e));
    }
}
