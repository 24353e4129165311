using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Time;
using EventReview.Data.Auth;
using EventReview.Data.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests;

/// <summary>
/// The data-layer tests, written once and run against every provider: <see cref="SqliteDataStoreTests"/> (a real
/// SQLite file in a temp folder) and <see cref="PostgresDataStoreTests"/> (a throwaway PostgreSQL server).
/// </summary>
public abstract partial class DataStoreTests : IAsyncLifetime
{
    private AppDbContextFactory? _factory;

    protected AppDbContextFactory Factory => _factory ?? throw new InvalidOperationException("Not initialised.");

    /// <summary>Settings for a database that is empty or was migrated by an earlier test of the same class.</summary>
    protected abstract Task<DatabaseSettings> SettingsAsync();

    public async Task InitializeAsync()
    {
        _factory = TestRecords.Factory(await SettingsAsync());
        await DatabaseInitializer.MigrateAsync(_factory);
    }

    public virtual Task DisposeAsync() => Task.CompletedTask;

    private static readonly TimeSpan StorePrecision = TimeSpan.FromTicks(1000);

    protected static string NewCandidateId() => "TC-" + Guid.NewGuid().ToString("N")[..10];

    private async Task<int> SaveNewAsync(ReviewCase c)
    {
        await using var db = Factory.CreateDbContext();
        db.Cases.Add(c);
        await db.SaveChangesAsync();
        return c.Id;
    }

    private async Task<ReviewCase> LoadAsync(int id)
    {
        await using var db = Factory.CreateDbContext();
        return await db.CasesWithEverything().AsNoTracking().SingleAsync(c => c.Id == id);
    }

    [Fact]
    public async Task Migrations_apply_completely_and_match_the_model()
    {
        await using var db = Factory.CreateDbContext();

        Assert.Empty(await db.Database.GetPendingMigrationsAsync());
        Assert.Equal(db.Database.GetMigrations(), await db.Database.GetAppliedMigrationsAsync());
        Assert.False(db.Database.HasPendingModelChanges(), "The model has changes that no migration captures.");
    }

    [Fact]
    public async Task Migrating_an_up_to_date_database_again_is_harmless()
    {
        var id = await SaveNewAsync(SampleCases.Open(NewCandidateId()));

        await DatabaseInitializer.MigrateAsync(Factory);

        Assert.Equal(id, (await LoadAsync(id)).Id);
    }

    [Fact]
    public async Task A_worked_case_round_trips_with_its_arrivals_items_evidence_sign_offs_and_timeline()
    {
        var original = SampleCases.Worked(NewCandidateId());
        var id = await SaveNewAsync(original);

        var loaded = await LoadAsync(id);

        Assert.Equal(original.CandidateId, loaded.CandidateId);
        Assert.Equal(original.GpsNanoseconds, loaded.GpsNanoseconds);
        Assert.Equal((original.Search, original.Summary, original.State, original.ChecklistName, original.ChecklistVersion, original.CoordinatorName, original.Version),
            (loaded.Search, loaded.Summary, loaded.State, loaded.ChecklistName, loaded.ChecklistVersion, loaded.CoordinatorName, loaded.Version));
        // Times outside the hashes are kept to the store's precision (SQLite 0.1 ms, PostgreSQL 1 µs).
        Assert.Equal(original.CreatedAt, loaded.CreatedAt, StorePrecision);
        Assert.Equal(original.UpdatedAt, loaded.UpdatedAt, StorePrecision);
        Assert.Equal(original.Arrivals.Select(a => (a.SiteCode, a.ArrivalNanoseconds, a.Snr)).Order(),
            loaded.Arrivals.Select(a => (a.SiteCode, a.ArrivalNanoseconds, a.Snr)).Order());

        var items = loaded.Items.OrderBy(i => i.SectionOrder).ThenBy(i => i.Order).ToList();
        Assert.Equal(["alpha.one", "alpha.two", "beta.one"], items.Select(i => i.Key));
        foreach (var before in original.Items)
        {
            var after = loaded.Item(before.Key);
            Assert.Equal((before.State, before.Version, before.OwnerId, before.OwnerName, before.DueDate, before.CheckKind, before.RequiredSignOffs, before.OwnerMaySign, before.Guidance, before.SectionTitle),
                (after.State, after.Version, after.OwnerId, after.OwnerName, after.DueDate, after.CheckKind, after.RequiredSignOffs, after.OwnerMaySign, after.Guidance, after.SectionTitle));
            Assert.Equal(before.Fingerprint(), after.Fingerprint());
            Assert.Equal(before.Evidence.Select(e => (e.Kind, e.ContentSha256, e.Text, e.FileName, e.Url, e.SizeBytes, e.AddedBy, e.AddedAt)),
                after.Evidence.OrderBy(e => e.Id).Select(e => (e.Kind, e.ContentSha256, e.Text, e.FileName, e.Url, e.SizeBytes, e.AddedBy, e.AddedAt)));
            Assert.Equal(before.SignOffs.Select(s => (s.UserId, s.SignerName, s.Meaning, s.Statement, s.EvidenceFingerprint, s.IsStale, s.StaleSince is null, s.SignedAtGpsNanoseconds)),
                after.SignOffs.OrderBy(s => s.Id).Select(s => (s.UserId, s.SignerName, s.Meaning, s.Statement, s.EvidenceFingerprint, s.IsStale, s.StaleSince is null, s.SignedAtGpsNanoseconds)));
            Assert.All(before.SignOffs.Zip(after.SignOffs.OrderBy(s => s.Id)), p => Assert.Equal(p.First.SignedAtUtc, p.Second.SignedAtUtc, StorePrecision));
            Assert.Equal(before.Computations.Select(r => r.ContentSha256), after.Computations.Select(r => r.ContentSha256));
        }

        Assert.Equal(original.Timeline.Select(a => (a.Sequence, a.Kind, a.ItemKey, a.Hash, a.PreviousHash)),
            loaded.Timeline.OrderBy(a => a.Sequence).Select(a => (a.Sequence, a.Kind, a.ItemKey, a.Hash, a.PreviousHash)));
    }

    [Fact]
    public async Task Times_keep_full_precision_so_the_timeline_and_fingerprints_still_verify_after_loading()
    {
        var original = SampleCases.Worked(NewCandidateId());
        var id = await SaveNewAsync(original);

        var loaded = await LoadAsync(id);

        Assert.Null(TimelineChain.FirstProblem(loaded.Timeline));
        var signed = loaded.Item("alpha.one");
        Assert.Equal(ItemState.SignedOff, signed.State);
        Assert.Equal(signed.Fingerprint(), signed.CurrentSignOffs.Single().EvidenceFingerprint);
    }

    [Fact]
    public async Task A_loaded_case_can_be_changed_and_saved_again_with_its_chain_intact()
    {
        var id = await SaveNewAsync(SampleCases.Worked(NewCandidateId()));
        var at = SampleCases.T0.AddHours(1).AddTicks(77);

        await using (var db = Factory.CreateDbContext())
        {
            var c = await db.CasesWithEverything().SingleAsync(x => x.Id == id);
            c.SignItem("alpha.two", SampleCases.ReviewerB, SignOffMeaning.Approved, "Second half.", c.Item("alpha.two").Fingerprint(), at, GpsUtc.FromUtc(at.UtcDateTime));
            await db.SaveChangesAsync();
        }

        var loaded = await LoadAsync(id);
        Assert.Equal(ItemState.SignedOff, loaded.Item("alpha.two").State);
        Assert.Equal(2, loaded.Item("alpha.two").CurrentSignOffs.Count());
        Assert.Null(TimelineChain.FirstProblem(loaded.Timeline));
    }

    [Fact]
    public async Task A_closed_case_keeps_its_outcome_and_statement()
    {
        var c = SampleCases.Open(NewCandidateId());
        var at = SampleCases.T0;
        foreach (var item in c.Items.ToList())
        {
            at = at.AddMinutes(1);
            c.AddEvidence(item.Key, EvidenceItem.Note("done", SampleCases.ReviewerA, at), SampleCases.ReviewerA, at);
            c.MarkItemReady(item.Key, SampleCases.ReviewerA, at);
            Actor[] signers = [SampleCases.ReviewerB, SampleCases.ReviewerC];
            for (var k = 0; k < item.RequiredSignOffs; k++)
            {
                c.SignItem(item.Key, signers[k], SignOffMeaning.Reviewed, "ok", c.Item(item.Key).Fingerprint(), at, GpsUtc.FromUtc(at.UtcDateTime));
            }
        }

        c.Close(CaseOutcome.Inconclusive, "Not enough to decide.", SampleCases.Coordinator, at.AddMinutes(1));
        var id = await SaveNewAsync(c);

        var loaded = await LoadAsync(id);

        Assert.Equal((CaseState.Closed, (CaseOutcome?)CaseOutcome.Inconclusive, "Not enough to decide."), (loaded.State, loaded.Outcome, loaded.ClosingStatement));
        Assert.Null(TimelineChain.FirstProblem(loaded.Timeline));
    }

    [Fact]
    public async Task Saving_a_case_whose_version_moved_on_throws_a_concurrency_exception_and_applies_nothing()
    {
        var id = await SaveNewAsync(SampleCases.Open(NewCandidateId()));
        await using var stale = Factory.CreateDbContext();
        var c = await stale.CasesWithEverything().SingleAsync(x => x.Id == id);
        await using (var other = Factory.CreateDbContext())
        {
            // Another writer bumps the version token without touching the timeline.
            Assert.Equal(1, await other.Cases.Where(x => x.Id == id).ExecuteUpdateAsync(s => s.SetProperty(x => x.Version, x => x.Version + 1)));
        }

        c.SetItemDue("alpha.one", new DateOnly(2026, 4, 1), SampleCases.Coordinator, SampleCases.T0.AddMinutes(1));

        await Assert.ThrowsAsync<DbUpdateConcurrencyException>(() => stale.SaveChangesAsync());

        var loaded = await LoadAsync(id);
        Assert.Null(loaded.Item("alpha.one").DueDate);
        Assert.Single(loaded.Timeline);
        Assert.Equal(2, loaded.Version);
    }

    [Fact]
    public async Task Two_contexts_changing_the_same_case_conflict_and_the_second_save_is_refused()
    {
        var id = await SaveNewAsync(SampleCases.Open(NewCandidateId()));
        await using var first = Factory.CreateDbContext();
        await using var second = Factory.CreateDbContext();
        var a = await first.CasesWithEverything().SingleAsync(c => c.Id == id);
        var b = await second.CasesWithEverything().SingleAsync(c => c.Id == id);
        var at = SampleCases.T0.AddMinutes(5);

        a.AssignItem("alpha.one", SampleCases.ReviewerA.UserId, SampleCases.ReviewerA.DisplayName, SampleCases.Coordinator, at);
        b.AssignItem("alpha.one", SampleCases.ReviewerB.UserId, SampleCases.ReviewerB.DisplayName, SampleCases.Coordinator, at);
        await first.SaveChangesAsync();

        // Refused either by the version token or by the timeline's unique (case, sequence) index, whichever the
        // provider checks first; both are DbUpdateException and both roll the whole save back.
        await Assert.ThrowsAnyAsync<DbUpdateException>(() => second.SaveChangesAsync());

        var loaded = await LoadAsync(id);
        Assert.Equal(SampleCases.ReviewerA.UserId, loaded.Item("alpha.one").OwnerId);
        Assert.Equal(2, loaded.Timeline.Count);
        Assert.Null(TimelineChain.FirstProblem(loaded.Timeline));
    }

    [Fact]
    public async Task Two_contexts_adding_evidence_to_different_items_of_the_same_case_still_conflict()
    {
        // The case version serialises the timeline: two writers must never both append entry n+1.
        var id = await SaveNewAsync(SampleCases.Open(NewCandidateId()));
        await using var first = Factory.CreateDbContext();
        await using var second = Factory.CreateDbContext();
        var a = await first.CasesWithEverything().SingleAsync(c => c.Id == id);
        var b = await second.CasesWithEverything().SingleAsync(c => c.Id == id);
        var at = SampleCases.T0.AddMinutes(5);

        a.AddEvidence("alpha.one", EvidenceItem.Note("from A", SampleCases.ReviewerA, at), SampleCases.ReviewerA, at);
        b.AddEvidence("beta.one", EvidenceItem.Note("from B", SampleCases.ReviewerB, at), SampleCases.ReviewerB, at);
        await first.SaveChangesAsync();

        await Assert.ThrowsAnyAsync<DbUpdateException>(() => second.SaveChangesAsync());

        var loaded = await LoadAsync(id);
        Assert.Single(loaded.Item("alpha.one").Evidence);
        Assert.Empty(loaded.Item("beta.one").Evidence);
        Assert.Null(TimelineChain.FirstProblem(loaded.Timeline));
    }

    [Fact]
    public async Task A_candidate_id_can_be_stored_only_once()
    {
        var candidate = NewCandidateId();
        await SaveNewAsync(SampleCases.Open(candidate));

        await Assert.ThrowsAnyAsync<DbUpdateException>(() => SaveNewAsync(SampleCases.Open(candidate)));

        await using var db = Factory.CreateDbContext();
        Assert.Equal(1, await db.Cases.CountAsync(c => c.CandidateId == candidate));
    }

    [Fact]
    public async Task An_api_token_is_stored_only_as_its_hash_and_can_be_revoked()
    {
        var created = new DateTimeOffset(2026, 3, 1, 12, 0, 0, TimeSpan.Zero);
        var (token, secret) = ApiToken.Create("pipeline " + Guid.NewGuid().ToString("N")[..6], "Coordinator Cole", created);
        await using (var db = Factory.CreateDbContext())
        {
            db.ApiTokens.Add(token);
            await db.SaveChangesAsync();
        }

        await using (var db = Factory.CreateDbContext())
        {
            var found = await db.ApiTokens.SingleAsync(t => t.Hash == ApiToken.HashOf(secret));
            Assert.True(found.IsActive);
            Assert.Equal(Roles.Pipeline, found.Role);
            Assert.DoesNotContain(secret, found.Hash, StringComparison.Ordinal);
            found.Revoke(created.AddDays(1));
            await db.SaveChangesAsync();
        }

        await using (var db = Factory.CreateDbContext())
        {
            var revoked = await db.ApiTokens.SingleAsync(t => t.Id == token.Id);
            Assert.False(revoked.IsActive);
            Assert.Equal(created.AddDays(1), revoked.RevokedAt);
            Assert.Equal(created, revoked.CreatedAt);
        }
    }
}
