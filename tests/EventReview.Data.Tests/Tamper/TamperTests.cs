using EventReview.Core.Cases;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;
using EventReview.Core.Injections;
using EventReview.Data.Auth;
using EventReview.Data.Records;
using EventReview.Data.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Data.Tests.Tamper;

/// <summary>
/// An intruder who can read and write the database and the attachment folder (and knows the source) but holds neither
/// the record key nor the witness changes the record, one kind of change per test, after dropping the database's
/// append-only triggers. <see cref="IntegrityVerifier"/> must name what does not match, and the untouched case must still
/// verify. Each test starts from a fresh database holding two worked cases (one with a frozen configuration record and
/// a stale sign-off), accounts, tokens and a sealed injection record. Written once, run on SQLite and PostgreSQL.
/// </summary>
public abstract partial class TamperTests : IAsyncLifetime
{
    private readonly TempFolder _folder = new("er-tamper");
    private ServiceProvider? _services;

    protected DatabaseSettings Settings { get; private set; } = default!;

    protected AppDbContextFactory Factory { get; private set; } = default!;

    protected RecordKeeping Records { get; private set; } = default!;

    protected AttachmentStore Store { get; private set; } = default!;

    protected int CaseId { get; private set; }

    protected string Candidate { get; private set; } = string.Empty;

    protected string Other { get; private set; } = string.Empty;

    protected int FrozenId { get; private set; }

    protected int CaptureId { get; private set; }

    protected string ObserverId { get; private set; } = string.Empty;

    protected int TokenId { get; private set; }

    protected int RevokedTokenId { get; private set; }

    protected int SealId { get; private set; }

    /// <summary>Database settings for a fresh database whose data folder is <paramref name="folder"/>.</summary>
    protected abstract Task<DatabaseSettings> SettingsAsync(string folder);

    /// <summary>Drops every append-only trigger (what the intruder does first).</summary>
    protected abstract Task DropGuardsAsync(AppDbContext db);

    /// <summary>A time as the provider stores it (a SQL parameter value).</summary>
    protected abstract object Stored(DateTimeOffset at);

    public async Task InitializeAsync()
    {
        Settings = await SettingsAsync(_folder.Path);
        Records = TestRecords.For(_folder.Path);
        Factory = new AppDbContextFactory(Settings, Records);
        await DatabaseInitializer.MigrateAsync(Factory);
        Store = new AttachmentStore(Settings);
        await Store.SaveAsync(new MemoryStream("abc"u8.ToArray()), 1024);
        await SeedAccountsAsync();

        var tampered = SampleCases.Worked("TC-TAMPER-" + Guid.NewGuid().ToString("N")[..6]);
        var other = SampleCases.Worked("TC-UNTOUCHED-" + Guid.NewGuid().ToString("N")[..6]);
        await using (var db = Factory.CreateDbContext())
        {
            db.Cases.AddRange(tampered, other);
            await db.SaveChangesAsync();
        }

        (CaseId, Candidate, Other) = (tampered.Id, tampered.CandidateId, other.CandidateId);
        await FreezeAsync();
    }

    private async Task SeedAccountsAsync()
    {
        var services = new ServiceCollection();
        services.AddLogging();
        services.AddSingleton(TimeProvider.System);
        services.AddEventReviewData(Settings, Records);
        services.AddEventReviewIdentityCore();
        _services = services.BuildServiceProvider();
        await using var scope = _services.CreateAsyncScope();
        var admin = scope.ServiceProvider.GetRequiredService<AccountAdmin>();
        await admin.EnsureRolesAsync();
        ObserverId = (await admin.CreateUserAsync("observer@example.org", Roles.Observer, null, "Olli Observer")).User.Id;
        await admin.CreateUserAsync("coord@example.org", Roles.Coordinator, null, "Coordinator Cole");
        TokenId = (await admin.CreateTokenAsync("pipeline", "Coordinator Cole")).Token.Id;
        RevokedTokenId = (await admin.CreateTokenAsync("old pipeline", "Coordinator Cole", [TokenScopes.CasesRead])).Token.Id;
        await admin.RevokeTokenAsync(RevokedTokenId, "Coordinator Cole");

        var audit = _services.GetRequiredService<AccountAudit>();
        await using var db = Factory.CreateDbContext();
        await using var held = await audit.HoldAsync();
        await using var tx = await db.Database.BeginTransactionAsync();
        var seal = SealedInjectionRecord.Register(Hashing.Sha256Hex("salt+record"), "blind injections, test run", SampleCases.Coordinator, SampleCases.T0);
        db.SealedInjectionRecords.Add(seal);
        await db.SaveChangesAsync();
        await audit.RecordInAsync(db, AccountEventKinds.SealRegistered, SampleCases.Coordinator.UserId, SampleCases.Coordinator.DisplayName, null, "seal", AuditFacts.Seal(seal));
        await tx.CommitAsync();
        SealId = seal.Id;
    }

    /// <summary>Captures two configuration records of site KX for the tampered case and freezes the first through the case (as the app does).</summary>
    private async Task FreezeAsync()
    {
        var items = new Dictionary<string, string> { ["daq.firmware"] = "4.2.1", ["calibration.version"] = "v17" };
        var frozen = ConfigurationSnapshot.Capture("KX", "before the run", items, SampleCases.Coordinator, SampleCases.T0.AddMinutes(-30), CaseId);
        var capture = ConfigurationSnapshot.Capture("KX", "weekly capture", items, SampleCases.Coordinator, SampleCases.T0.AddDays(1), CaseId);
        await using (var db = Factory.CreateDbContext())
        {
            db.ConfigurationSnapshots.AddRange(frozen, capture);
            await db.SaveChangesAsync();
        }

        (FrozenId, CaptureId) = (frozen.Id, capture.Id);
        await using (var db = Factory.CreateDbContext())
        {
            var c = await db.CasesWithEverything().FirstAsync(x => x.Id == CaseId);
            var snapshot = await db.ConfigurationSnapshots.FirstAsync(s => s.Id == FrozenId);
            var at = SampleCases.T0.AddHours(1);
            snapshot.Freeze(CaseId, SampleCases.T0.AddHours(-1), SampleCases.T0.AddDays(7), "Candidate under review.", SampleCases.Coordinator, at);
            c.AddComputation("beta.one", new ComputationRecord("configuration", "{}", snapshot.Fingerprint!, "test", "{}", "frozen", "KX frozen", string.Empty, SampleCases.Coordinator, at),
                SampleCases.Coordinator, at, snapshot);
            await db.SaveChangesAsync();
        }
    }

    public async Task DisposeAsync()
    {
        if (_services is not null)
        {
            await _services.DisposeAsync();
        }

        Records.Dispose();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Npgsql.NpgsqlConnection.ClearAllPools();
        _folder.Dispose();
    }

    /// <summary>Every problem of the whole-record verification; the untouched case must have none.</summary>
    protected async Task<IReadOnlyList<IntegrityProblem>> VerifyAsync()
    {
        var (cases, database) = await new IntegrityVerifier(Factory, Store, Settings, Records).VerifyAsync();
        var untouched = cases.SingleOrDefault(c => c.CandidateId == Other);
        Assert.True(untouched is null || untouched.Valid, "the untouched case must still verify: " + string.Join("; ", untouched?.Problems.Select(p => p.What) ?? []));
        return database.Concat(cases.SelectMany(c => c.Problems)).ToList();
    }

    /// <summary>Verifies and asserts that a problem of <paramref name="case"/> (default: the tampered case) says all of <paramref name="words"/>; returns it.</summary>
    protected async Task<IntegrityProblem> CaughtAsync(string? @case, params string[] words)
    {
        var problems = await VerifyAsync();
        Assert.NotEmpty(problems);
        var name = @case ?? Candidate;
        var hit = problems.FirstOrDefault(p => p.Case == name && words.All(w => p.What.Contains(w, StringComparison.Ordinal)));
        Assert.True(hit is not null, $"no problem of {name} says [{string.Join("], [", words)}]; found:\n" + string.Join("\n", problems.Select(p => $"{p.Case} {p.Entry} {p.Item}: {p.What}")));
        return hit!;
    }

    /// <summary>Drops the triggers and runs the statements; "@case" stands for the tampered case's id. Values go in as {0}, {1}, ...</summary>
    protected async Task IntrudeAsync(string sql, params object[] values)
    {
        await using var db = Factory.CreateDbContext();
        await DropGuardsAsync(db);
#pragma warning disable EF1002 // fixed test SQL with the case id as a number
        await db.Database.ExecuteSqlRawAsync(sql.Replace("@case", CaseId.ToString(System.Globalization.CultureInfo.InvariantCulture), StringComparison.Ordinal), values);
#pragma warning restore EF1002
    }

    /// <summary>The id of the tampered case's item <paramref name="key"/> (SQL).</summary>
    protected static string Item(string key) => $"(SELECT \"Id\" FROM \"ChecklistItems\" WHERE \"ReviewCaseId\" = @case AND \"Key\" = '{key}')";

    /// <summary>
    /// Rewrites the tampered case's timeline from <paramref name="from"/> on as someone who knows the format but not the
    /// key would: <paramref name="change"/> edits an entry (text, facts), then every hash and link is recomputed.
    /// </summary>
    protected async Task RewriteChainAsync(int from, Func<TimelineEntry, (string Text, string? Facts)> change)
    {
        await using var db = Factory.CreateDbContext();
        await DropGuardsAsync(db);
        var entries = await db.Timeline.AsNoTracking().Where(a => a.ReviewCaseId == CaseId).OrderBy(a => a.Sequence).ToListAsync();
        var previous = entries.First(a => a.Sequence == from).PreviousHash;
        foreach (var e in entries.Where(a => a.Sequence >= from))
        {
            var (text, facts) = e.Sequence == from ? change(e) : (e.Text, e.Facts);
            var hash = TimelineEntry.ComputeHash(e.CandidateId, e.Sequence, e.At, e.ActorId, e.ActorName, e.Kind, e.ItemKey, text, facts, previous);
            await db.Database.ExecuteSqlRawAsync("UPDATE \"Timeline\" SET \"Text\" = {0}, \"Facts\" = {1}, \"PreviousHash\" = {2}, \"Hash\" = {3} WHERE \"Id\" = {4}",
                text, (object?)facts ?? DBNull.Value, previous, hash, e.Id);
            previous = hash;
        }
    }

    /// <summary>The tampered case's timeline entries, oldest first.</summary>
    protected async Task<List<TimelineEntry>> EntriesAsync()
    {
        await using var db = Factory.CreateDbContext();
        return await db.Timeline.AsNoTracking().Where(a => a.ReviewCaseId == CaseId).OrderBy(a => a.Sequence).ToListAsync();
    }
}
