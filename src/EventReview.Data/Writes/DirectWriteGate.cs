using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Writes;

/// <summary>
/// For servers that handle concurrent writers themselves (PostgreSQL): a plain save, which commits (its chain heads go to
/// the witness as it commits, see <see cref="Records.RecordSigningInterceptor"/>).
/// </summary>
public sealed class DirectWriteGate(AppDbContextFactory factory) : IWriteGate
{
    public Task SaveAsync(AppDbContext db, CancellationToken ct = default) => db.SaveChangesAsync(ct);

    public async Task<T> RunAsync<T>(Func<AppDbContext, CancellationToken, Task<T>> work, CancellationToken ct = default)
    {
        await using var db = factory.CreateDbContext();
        return await work(db, ct);
    }

    public async Task<T> RunSqlAsync<T>(Func<SqlUnit, CancellationToken, Task<T>> work, CancellationToken ct = default)
    {
        await using var db = factory.CreateDbContext();
        var connection = db.Database.GetDbConnection();
        await db.Database.OpenConnectionAsync(ct);
        await using var tx = await connection.BeginTransactionAsync(ct);
        using var unit = new SqlUnit(factory.Settings.Provider, connection, tx, prepared: null, factory.Records);
        var result = await work(unit, ct);
        await tx.CommitAsync(ct);
        factory.Records?.Committed(unit.Heads);
        return result;
    }
}
