using System.Security.Claims;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;

namespace EventReview.Web.Tests.Checks;

/// <summary>
/// The real app over a SQLite file in a temp folder of its own, started in Development with the demo seeded (which runs
/// the background demo step on ER-C-0142). Services are called directly through <see cref="WebApplicationFactory{T}.Services"/>.
/// </summary>
public sealed class BackgroundAppFactory : WebApplicationFactory<Program>, IAsyncLifetime
{
    private readonly string _dataDirectory = Path.Combine(Path.GetTempPath(), $"er-bg-{Guid.NewGuid():N}");

    /// <summary>A reviewer principal shaped like the app's own (role claim, id, display name).</summary>
    public static ClaimsPrincipal Reviewer { get; } = new(new ClaimsIdentity(
    [
        new Claim(ClaimTypes.NameIdentifier, "test-reviewer"),
        new Claim(ClaimTypes.Name, "test.reviewer@demo.invalid"),
        new Claim(UserClaims.DisplayName, "Test Reviewer"),
        new Claim(ClaimTypes.Role, Roles.Reviewer),
    ], "tests"));

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        Directory.CreateDirectory(_dataDirectory);
        builder.UseEnvironment("Development");
        builder.UseSetting("EventReview:DataDirectory", _dataDirectory);
        builder.UseSetting("EventReview:SeedDemo", "true");
    }

    Task IAsyncLifetime.InitializeAsync()
    {
        _ = Server; // migrate and seed once
        return Task.CompletedTask;
    }

    async Task IAsyncLifetime.DisposeAsync()
    {
        await base.DisposeAsync();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        try
        {
            Directory.Delete(_dataDirectory, recursive: true);
        }
        catch (IOException)
        {
        }
    }
}
