using System.Reflection;
using System.Text.RegularExpressions;
using EventReview.Data.Writes;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata;

namespace EventReview.Data.Tests.Writes;

/// <summary>
/// The short append path (<see cref="EvidenceAppendSql"/>) writes its statements by hand; they must name only the
/// tables and columns of the EF model, on both providers, and each INSERT and UPDATE only columns of its own table.
/// A renamed property or table fails here instead of at the first pipeline write.
/// </summary>
public sealed partial class ShortAppendSqlModelTests
{
    public static TheoryData<string> Providers => new() { "Sqlite", "Postgres" };

    [Theory]
    [MemberData(nameof(Providers))]
    public void Every_name_in_the_short_append_statements_is_a_table_or_column_of_the_model(string provider)
    {
        using var db = Context(provider);
        var tables = db.Model.GetEntityTypes()
            .Where(e => e.GetTableName() is not null)
            .GroupBy(e => e.GetTableName()!)
            .ToDictionary(g => g.Key, g => g.SelectMany(e => Columns(e)).ToHashSet(StringComparer.Ordinal), StringComparer.Ordinal);
        var allColumns = tables.Values.SelectMany(c => c).ToHashSet(StringComparer.Ordinal);
        var statements = Statements();
        Assert.True(statements.Count >= 9, "the short path's statements were not found");

        foreach (var (name, sql) in statements)
        {
            foreach (Match m in QuotedName().Matches(sql))
            {
                var id = m.Groups[1].Value;
                Assert.True(tables.ContainsKey(id) || allColumns.Contains(id), $"{name}: \"{id}\" is neither a table nor a column of the {provider} model");
            }

            if (InsertInto().Match(sql) is { Success: true } insert)
            {
                var table = insert.Groups[1].Value;
                Assert.True(tables.ContainsKey(table), $"{name}: no table \"{table}\"");
                foreach (Match c in QuotedName().Matches(insert.Groups[2].Value))
                {
                    Assert.True(tables[table].Contains(c.Groups[1].Value), $"{name}: \"{table}\" has no column \"{c.Groups[1].Value}\"");
                }
            }

            if (UpdateSet().Match(sql) is { Success: true } update)
            {
                var table = update.Groups[1].Value;
                Assert.True(tables.ContainsKey(table), $"{name}: no table \"{table}\"");
                foreach (Match c in Assignment().Matches(update.Groups[2].Value))
                {
                    Assert.True(tables[table].Contains(c.Groups[1].Value), $"{name}: \"{table}\" has no column \"{c.Groups[1].Value}\"");
                }
            }
        }
    }

    [Fact]
    public void The_check_would_catch_a_misspelt_column()
    {
        // The control: the same matching finds a name the model does not have.
        using var db = Context("Sqlite");
        var columns = db.Model.GetEntityTypes().SelectMany(e => Columns(e)).ToHashSet(StringComparer.Ordinal);
        var names = QuotedName().Matches("""INSERT INTO "Evidence" ("ChecklistItemId", "AddedOn")""").Select(m => m.Groups[1].Value).ToList();
        Assert.Contains("AddedOn", names);
        Assert.DoesNotContain("AddedOn", columns);
        Assert.Contains("ChecklistItemId", columns);
    }

    private static IEnumerable<string> Columns(IEntityType entity)
    {
        var table = StoreObjectIdentifier.Table(entity.GetTableName()!, entity.GetSchema());
        return entity.GetProperties().Select(p => p.GetColumnName(table)).OfType<string>();
    }

    /// <summary>The statements of both routes: the plan's (<see cref="EvidenceAppendSql"/>) and PostgreSQL's reads (<c>EvidenceAppendPostgres</c>).</summary>
    private static List<(string Name, string Sql)> Statements() =>
        new[] { typeof(EvidenceAppendSql), typeof(EvidenceAppendSql).Assembly.GetType("EventReview.Data.Writes.EvidenceAppendPostgres", throwOnError: true)! }
            .SelectMany(t => t.GetFields(BindingFlags.NonPublic | BindingFlags.Public | BindingFlags.Static))
            .Where(f => f.IsLiteral && f.FieldType == typeof(string) && f.Name.EndsWith("Sql", StringComparison.Ordinal))
            .Select(f => (f.DeclaringType!.Name + "." + f.Name, (string)f.GetRawConstantValue()!))
            .ToList();

    private static AppDbContext Context(string provider) => provider == "Sqlite"
        ? new SqliteAppDbContext(new DbContextOptionsBuilder<SqliteAppDbContext>().UseSqlite("Data Source=:memory:").Options)
        : new PostgresAppDbContext(new DbContextOptionsBuilder<PostgresAppDbContext>().UseNpgsql("Host=127.0.0.1;Database=none").Options);

    [GeneratedRegex("\"([A-Za-z0-9_]+)\"")]
    private static partial Regex QuotedName();

    [GeneratedRegex("INSERT INTO \"([A-Za-z0-9_]+)\"\\s*\\(([^)]*)\\)")]
    private static partial Regex InsertInto();

    [GeneratedRegex("UPDATE \"([A-Za-z0-9_]+)\" SET (.*?) WHERE", RegexOptions.Singleline)]
    private static partial Regex UpdateSet();

    [GeneratedRegex("\"([A-Za-z0-9_]+)\"\\s*=")]
    private static partial Regex Assignment();
}
