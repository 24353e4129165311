using System.Data.Common;
using System.Globalization;
using EventReview.Core.Cases;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata;

namespace EventReview.Data;

/// <summary>
/// The repair path of verification: reads every column of every table raw and converts each value the way the app
/// would, naming each value that cannot be read (an unknown state word, text in a number column, a null where none may
/// be) or that would break the pages that show it (a number that is not finite). A row that cannot be read also stops
/// its case from loading; this says which value to repair.
/// </summary>
public static class StoredValueScan
{
    /// <summary>Most values named (the scan stops after this many).</summary>
    public const int MaxProblems = 100;

    /// <summary>Every unreadable value, as problems of the pseudo-case "(stored values)".</summary>
    public static async Task<IReadOnlyList<IntegrityProblem>> FindAsync(AppDbContext db, CancellationToken ct = default)
    {
        var problems = new List<IntegrityProblem>();
        var connection = db.Database.GetDbConnection();
        await db.Database.OpenConnectionAsync(ct);
        try
        {
            foreach (var type in db.Model.GetEntityTypes().Where(t => t.GetTableName() is not null && !t.IsOwned()).OrderBy(t => t.GetTableName(), StringComparer.Ordinal))
            {
                await ScanAsync(connection, type, problems, ct);
                if (problems.Count >= MaxProblems)
                {
                    break;
                }
            }
        }
        finally
        {
            await db.Database.CloseConnectionAsync();
        }

        return problems;
    }

    private static async Task ScanAsync(DbConnection connection, IEntityType type, List<IntegrityProblem> problems, CancellationToken ct)
    {
        var table = type.GetTableName()!;
        var store = StoreObjectIdentifier.Table(table, type.GetSchema());
        var properties = type.GetProperties().Where(p => p.GetColumnName(store) is not null).ToList();
        var keys = type.FindPrimaryKey()?.Properties.ToList() ?? [];
        await using var cmd = connection.CreateCommand();
        cmd.CommandText = $"SELECT {string.Join(", ", properties.Select(p => Quote(p.GetColumnName(store)!)))} FROM {Quote(table)}";
        await using var reader = await cmd.ExecuteReaderAsync(ct);
        while (await reader.ReadAsync(ct))
        {
            for (var i = 0; i < properties.Count; i++)
            {
                if (Problem(reader, i, properties[i]) is not { } what)
                {
                    continue;
                }

                var key = string.Join(", ", keys.Select(k => $"{k.GetColumnName(store)} {Raw(reader, properties.IndexOf(k))}"));
                problems.Add(new IntegrityProblem("(stored values)", null, null, $"Table {table}, row {key}, column {properties[i].GetColumnName(store)}: {what}"));
                if (problems.Count >= MaxProblems)
                {
                    return;
                }
            }
        }
    }

    /// <summary>What is wrong with the value in column <paramref name="i"/>, or null when it reads as the app expects.</summary>
    private static string? Problem(DbDataReader reader, int i, IProperty p)
    {
        object raw;
        try
        {
            raw = reader.GetValue(i);
        }
        catch (Exception ex) when (ex is InvalidCastException or FormatException or OverflowException)
        {
            return $"the stored value cannot be read ({ex.Message}).";
        }

        if (raw is DBNull)
        {
            return p.IsNullable ? null : "holds no value, but one is required.";
        }

        try
        {
            var value = Convert(raw, p);
            return value switch
            {
                double d when !double.IsFinite(d) => $"holds {Show(raw)}, which is not a finite number: pages that show it would fail.",
                float f when !float.IsFinite(f) => $"holds {Show(raw)}, which is not a finite number: pages that show it would fail.",
                _ => null,
            };
        }
        catch (Exception ex) when (ex is InvalidCastException or FormatException or OverflowException or ArgumentException or InvalidOperationException)
        {
            return $"holds {Show(raw)}, which cannot be read as {Describe(p)} ({ex.Message}).";
        }
    }

    private static object? Convert(object raw, IProperty p)
    {
        var converter = p.GetTypeMapping().Converter;
        var target = converter?.ProviderClrType ?? Nullable.GetUnderlyingType(p.ClrType) ?? p.ClrType;
        object provider = target.IsInstanceOfType(raw) ? raw
            : target == typeof(DateTimeOffset) && raw is DateTime dt ? new DateTimeOffset(DateTime.SpecifyKind(dt, DateTimeKind.Utc))
            : target == typeof(Guid) && raw is string g ? Guid.Parse(g)
            : target == typeof(DateOnly) && raw is string day ? DateOnly.Parse(day, CultureInfo.InvariantCulture)
            : target == typeof(DateOnly) && raw is DateTime date ? DateOnly.FromDateTime(date)
            : target == typeof(bool) && raw is long b ? b != 0
            : target.IsEnum ? Enum.Parse(target, System.Convert.ToString(raw, CultureInfo.InvariantCulture)!)
            : System.Convert.ChangeType(raw, target, CultureInfo.InvariantCulture);
        if (converter is not null)
        {
            var value = converter.ConvertFromProvider(provider);
            return value is Enum e && !Enum.IsDefined(e.GetType(), e) ? throw new ArgumentException($"'{provider}' is not one of {string.Join(", ", Enum.GetNames(e.GetType()))}") : value;
        }

        return provider is Enum pe && !Enum.IsDefined(pe.GetType(), pe) ? throw new ArgumentException($"{provider} is not a known value") : provider;
    }

    private static string Describe(IProperty p) => (Nullable.GetUnderlyingType(p.ClrType) ?? p.ClrType) is var t && t.IsEnum
        ? $"one of {string.Join(", ", Enum.GetNames(t))}"
        : (Nullable.GetUnderlyingType(p.ClrType) ?? p.ClrType).Name;

    private static string Raw(DbDataReader reader, int i)
    {
        try
        {
            return i < 0 ? "?" : Show(reader.GetValue(i));
        }
        catch (Exception ex) when (ex is InvalidCastException or FormatException or OverflowException)
        {
            return "?";
        }
    }

    private static string Show(object raw)
    {
        var s = raw switch
        {
            double d => d.ToString("R", CultureInfo.InvariantCulture),
            byte[] bytes => $"{bytes.Length} bytes",
            _ => System.Convert.ToString(raw, CultureInfo.InvariantCulture) ?? string.Empty,
        };
        return "'" + (s.Length > 60 ? s[..60] + "…" : s) + "'";
    }

    private static string Quote(string name) => "\"" + name.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
}
