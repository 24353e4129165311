using System.Security.Claims;
using System.Text;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Demo;
using EventReview.Web.Services;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Checks;

/// <summary>
/// The real app over a fresh SQLite folder (no demo), with the invented three-site network and helpers to open a case,
/// attach text files and get services. One per test class; disposed with the folder.
/// </summary>
public sealed class LocalCausesHarness : IAsyncLifetime
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "er-localcauses-" + Guid.NewGuid().ToString("N"));
    private WebApplicationFactory<Program> _factory = default!;

    public ClaimsPrincipal Coordinator { get; } = Principal("coord-1", "Test Coordinator", Roles.Coordinator);

    public ClaimsPrincipal Reviewer { get; } = Principal("rev-1", "Test Reviewer", Roles.Reviewer);

    public IServiceProvider Services => _factory.Services;

    public async Task InitializeAsync()
    {
        _factory = new WebApplicationFactory<Program>().WithWebHostBuilder(b =>
        {
            b.UseSetting("EventReview:DataDirectory", _dir);
            b.UseSetting("EventReview:SeedDemo", "false");
            b.UseSetting("Database:Provider", "Sqlite");
        });
        _ = _factory.Server; // starts the app: migrations applied
        using var scope = Services.CreateScope();
        await scope.ServiceProvider.GetRequiredService<NetworkService>().ReplaceAsync(Coordinator, DemoNetwork.Name, DemoNetwork.Sites());
    }

    public async Task DisposeAsync()
    {
        await _factory.DisposeAsync();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        try
        {
            Directory.Delete(_dir, true);
        }
        catch (IOException)
        {
        }
    }

    /// <summary>A service from a fresh scope (scoped services live as long as the test needs them).</summary>
    public T Get<T>() where T : notnull => Services.CreateScope().ServiceProvider.GetRequiredService<T>();

    /// <summary>Opens a case with arrivals at the given sites (seconds after <paramref name="gps"/>).</summary>
    public async Task<Core.Cases.ReviewCase> OpenCaseAsync(string candidateId, decimal gps, string checklist, params (string Site, double DelaySeconds)[] arrivals)
    {
        var request = new OpenCaseRequest(candidateId, gps, "test-search", "test case", arrivals.Select(a => new ArrivalRequest(a.Site, gps + (decimal)a.DelaySeconds, 10)).ToList(), checklist);
        return (await Get<CaseWorkflow>().OpenAsync(Coordinator, request)).Case;
    }

    /// <summary>Attaches text as a file to an item; returns its SHA-256.</summary>
    public async Task<string> AttachAsync(int caseId, string itemKey, string fileName, string text)
    {
        var bytes = Encoding.UTF8.GetBytes(text);
        await using var s = new MemoryStream(bytes);
        await Get<EvidenceAppender>().AddAttachmentAsync(Reviewer, caseId, itemKey, s, fileName, "text/plain", "test input", long.MaxValue);
        return Core.Evidence.Hashing.Sha256Hex(bytes);
    }

    private static ClaimsPrincipal Principal(string id, string name, string role) => new(new ClaimsIdentity(
    [
        new Claim(ClaimTypes.NameIdentifier, id),
        new Claim(ClaimTypes.Name, id + "@test.invalid"),
        new Claim(UserClaims.DisplayName, name),
        new Claim(ClaimTypes.Role, role),
    ], "test"));
}
