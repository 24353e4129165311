using System.Globalization;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Time;
using EventReview.Data.Tests.Fixtures;
using FsCheck;
using FsCheck.Xunit;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata;

namespace EventReview.Data.Tests.Tamper;

/// <summary>
/// Property: over random sequences of review actions (notes, links, files, computations, owners, due dates, state changes,
/// sign-offs, submission, return, closing; refused actions change nothing), the stored case verifies; and any single
/// alteration of one stored row of it (one column of review meaning changed, or the row deleted) makes it fail.
/// One SQLite database (its triggers dropped, as an intruder would) holds every generated case.
/// </summary>
public sealed class SignedRecordProperties : IAsyncLifetime
{
    private static readonly Actor[] People = [SampleCases.ReviewerA, SampleCases.ReviewerB, SampleCases.ReviewerC, SampleCases.Coordinator];
    private static readonly string[] Keys = ["alpha.one", "alpha.two", "beta.one"];
    private static readonly string[] Tables = ["Cases", "CaseArrivals", "ChecklistItems", "Evidence", "Computations", "SignOffs", "Timeline"];

    /// <summary>Columns that carry no review meaning: row ids, links to the parent row, optimistic-concurrency versions.</summary>
    private static readonly HashSet<string> Skipped = ["Id", "ReviewCaseId", "ChecklistItemId", "Version"];

    private readonly TempFolder _folder = new("er-props");
    private AppDbContextFactory _factory = default!;
    private DatabaseSettings _settings = default!;
    private Data.Records.RecordKeeping _records = default!;

    public async Task InitializeAsync()
    {
        _settings = DatabaseSettings.ForSqlite(_folder.Path);
        _records = TestRecords.For(_folder.Path);
        _factory = new AppDbContextFactory(_settings, _records);
        await DatabaseInitializer.MigrateAsync(_factory);
        await using var db = _factory.CreateDbContext();
        foreach (var name in await db.Database.SqlQueryRaw<string>("SELECT name AS \"Value\" FROM sqlite_master WHERE type = 'trigger'").ToListAsync())
        {
#pragma warning disable EF1002 // trigger names read from the schema
            await db.Database.ExecuteSqlRawAsync($"DROP TRIGGER \"{name}\"");
#pragma warning restore EF1002
        }
    }

    public Task DisposeAsync()
    {
        _records.Dispose();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        _folder.Dispose();
        return Task.CompletedTask;
    }

    [Property(MaxTest = 40, EndSize = 200)]
    public void Any_review_verifies_and_any_single_row_alteration_is_caught(byte[] script, PositiveInt pick) =>
        RunAsync(script, pick.Get).GetAwaiter().GetResult();

    private async Task RunAsync(byte[] script, int pick)
    {
        var c = Review(script);
        var store = new AttachmentStore(_settings);
        foreach (var e in c.Items.SelectMany(i => i.Evidence).Where(e => e.Kind == EvidenceKind.Attachment))
        {
            await store.SaveAsync(new MemoryStream(System.Text.Encoding.UTF8.GetBytes(e.Text)), 1024);
        }

        await using (var db = _factory.CreateDbContext())
        {
            db.Cases.Add(c);
            await db.SaveChangesAsync();
        }

        var before = await ProblemsAsync(c.Id);
        Assert.True(before.Count == 0, $"{c.Timeline.Count} entries; an unaltered review must verify: " + string.Join("; ", before));

        var alteration = await AlterAsync(c.Id, pick);
        var after = await ProblemsAsync(c.Id);
        Assert.True(after.Count > 0, $"not caught: {alteration}");
    }

    /// <summary>Plays the script as review actions on a fresh case: each three bytes are an action, an item and a person.</summary>
    private static ReviewCase Review(byte[] script)
    {
        var c = SampleCases.Open("TC-PROP-" + Guid.NewGuid().ToString("N")[..10]);
        var t = SampleCases.T0;
        for (var i = 0; i + 2 < Math.Min(script.Length, 90); i += 3)
        {
            var (key, who) = (Keys[script[i + 1] % Keys.Length], People[script[i + 2] % People.Length]);
            t = t.AddMilliseconds(1 + script[i + 1]);
            var at = t;
            try
            {
                Act(c, script[i] % 14, key, who, at, i);
            }
            catch (DomainRuleException)
            {
                // Refused: nothing changed.
            }
        }

        return c;
    }

    private static void Act(ReviewCase c, int action, string key, Actor who, DateTimeOffset at, int n)
    {
        switch (action)
        {
            case 0: c.AddEvidence(key, EvidenceItem.Note($"Note {n} on *{key}*.", who, at), who, at); break;
            case 1: c.AddEvidence(key, EvidenceItem.Link($"https://log.example.invalid/{n}", $"Entry {n}", who, at), who, at); break;
            case 2: c.AddEvidence(key, EvidenceItem.Attachment($"trace-{n}.txt", "text/plain", n + 3, Hashing.Sha256Hex($"Trace {n}"), $"Trace {n}", who, at), who, at); break;
            case 3:
                c.AddComputation(key, new ComputationRecord(CheckKind.Timing, $"{{\"k\":{n}}}", Hashing.Sha256Hex($"in {n}"), "test", "{}", n % 2 == 0 ? "consistent" : "concern",
                    $"run {n}", n % 3 == 0 ? "<svg/>" : string.Empty, who, at), who, at);
                break;
            case 4: c.AssignItem(key, n % 5 == 0 ? null : who.UserId, who.DisplayName, SampleCases.Coordinator, at); break;
            case 5: c.SetItemDue(key, n % 4 == 0 ? null : new DateOnly(2026, 3, 2).AddDays(n % 9), SampleCases.Coordinator, at); break;
            case 6: c.StartItem(key, who, at); break;
            case 7 or 8: c.MarkItemReady(key, who, at); break;
            case 9: c.WithdrawItem(key, who, at); break;
            case 10 or 11:
                c.SignItem(key, who, n % 2 == 0 ? SignOffMeaning.Reviewed : SignOffMeaning.Approved, $"Signed {n}.", c.Item(key).Fingerprint(), at, GpsUtc.FromUtc(at.UtcDateTime));
                break;
            case 12:
                if (c.State == CaseState.AwaitingDecision)
                {
                    c.ReturnToReview($"More to do ({n}).", SampleCases.Coordinator, at);
                }
                else
                {
                    c.SubmitForDecision(SampleCases.Coordinator, at);
                }

                break;
            default: c.Close((CaseOutcome)(n % 4), $"Decided ({n}).", SampleCases.Coordinator, at); break;
        }
    }

    private async Task<IReadOnlyList<string>> ProblemsAsync(int caseId)
    {
        var (cases, _) = await new IntegrityVerifier(_factory, new AttachmentStore(_settings), _settings, _records).VerifyAsync(caseId);
        return cases.SelectMany(c => c.Problems).Select(p => $"{p.Entry} {p.Item}: {p.What}").ToList();
    }

    /// <summary>Changes one column of one row of the case (or deletes one row), chosen by <paramref name="pick"/>; says what it did.</summary>
    private async Task<string> AlterAsync(int caseId, int pick)
    {
        await using var db = _factory.CreateDbContext();
        var cells = new List<(IEntityType Type, string Table, long Id, IProperty? Column)>();
        foreach (var table in Tables)
        {
            var type = db.Model.GetEntityTypes().Single(t => t.GetTableName() == table);
            var owner = table switch
            {
                "Cases" => $"\"Id\" = {caseId}",
                "CaseArrivals" or "ChecklistItems" or "Timeline" => $"\"ReviewCaseId\" = {caseId}",
                _ => $"\"ChecklistItemId\" IN (SELECT \"Id\" FROM \"ChecklistItems\" WHERE \"ReviewCaseId\" = {caseId})",
            };
#pragma warning disable EF1002 // fixed test SQL with numbers only
            var ids = await db.Database.SqlQueryRaw<long>($"SELECT \"Id\" AS \"Value\" FROM \"{table}\" WHERE {owner}").ToListAsync();
#pragma warning restore EF1002
            foreach (var id in ids)
            {
                cells.AddRange(type.GetProperties().Where(p => !Skipped.Contains(p.Name) && p.GetColumnName() is not null).Select(p => (type, table, id, (IProperty?)p)));
                if (table is not ("Cases" or "ChecklistItems"))
                {
                    cells.Add((type, table, id, null));
                }
            }
        }

        var (_, tableName, rowId, column) = cells[pick % cells.Count];
        var connection = db.Database.GetDbConnection();
        await connection.OpenAsync();
        await using var cmd = connection.CreateCommand();
        if (column is null)
        {
            cmd.CommandText = $"DELETE FROM \"{tableName}\" WHERE \"Id\" = {rowId}";
            await cmd.ExecuteNonQueryAsync();
            return $"deleted {tableName} row {rowId}";
        }

        var name = column.GetColumnName();
        cmd.CommandText = $"SELECT \"{name}\" FROM \"{tableName}\" WHERE \"Id\" = {rowId}";
        var old = await cmd.ExecuteScalarAsync();
        var changed = Changed(column, old is DBNull ? null : old);
        cmd.CommandText = $"UPDATE \"{tableName}\" SET \"{name}\" = $v WHERE \"Id\" = {rowId}";
        var p = cmd.CreateParameter();
        p.ParameterName = "$v";
        p.Value = changed;
        cmd.Parameters.Add(p);
        await cmd.ExecuteNonQueryAsync();
        return $"{tableName} row {rowId}: {name} {old} -> {changed}";
    }

    /// <summary>A different value of the same stored type (SQLite: times as ticks, dates and enumerations as text).</summary>
    private static object Changed(IProperty column, object? old)
    {
        var type = Nullable.GetUnderlyingType(column.ClrType) ?? column.ClrType;
        if (type == typeof(bool))
        {
            return Convert.ToInt64(old ?? 0L, CultureInfo.InvariantCulture) == 0 ? 1L : 0L;
        }

        if (type == typeof(DateOnly))
        {
            return old is string day ? DateOnly.Parse(day, CultureInfo.InvariantCulture).AddDays(1).ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) : "2030-01-01";
        }

        if (type == typeof(double))
        {
            return Convert.ToDouble(old ?? 0.0, CultureInfo.InvariantCulture) + 0.25;
        }

        if (type == typeof(DateTimeOffset))
        {
            return old is null ? SampleCases.T0.UtcTicks : Convert.ToInt64(old, CultureInfo.InvariantCulture) + TimeSpan.TicksPerMillisecond;
        }

        if (type == typeof(int) || type == typeof(long))
        {
            return Convert.ToInt64(old ?? 0L, CultureInfo.InvariantCulture) + (column.Name == "Sequence" ? 1000 : 1);
        }

        return old is string s ? s + "x" : "x";
    }
}
