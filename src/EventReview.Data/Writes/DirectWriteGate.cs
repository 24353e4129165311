namespace EventReview.Data.Writes;

/// <summary>For servers that handle concurrent writers themselves (PostgreSQL): a plain save, which commits.</summary>
public sealed class DirectWriteGate(AppDbContextFactory factory) : IWriteGate
{
    public Task SaveAsync(AppDbContext db, CancellationToken ct = default) => db.SaveChangesAsync(ct);

    public async Task<T> RunAsync<T>(Func<AppDbContext, CancellationToken, Task<T>> work, CancellationToken ct = default)
    {
        await using var db = factory.CreateDbContext();
        return await work(db, ct);
    }
}
