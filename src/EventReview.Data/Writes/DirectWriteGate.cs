namespace EventReview.Data.Writes;

/// <summary>
/// For servers that handle concurrent writers themselves (PostgreSQL): each unit of work runs on its own context
/// and connection, and its <c>SaveChangesAsync</c> commits.
/// </summary>
public sealed class DirectWriteGate(AppDbContextFactory factory) : IWriteGate
{
    public async Task<T> RunAsync<T>(Func<AppDbContext, CancellationToken, Task<T>> work, CancellationToken ct = default)
    {
        await using var db = factory.CreateDbContext();
        return await work(db, ct);
    }
}
