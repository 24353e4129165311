namespace EventReview.Data.Writes;

/// <summary>For servers that handle concurrent writers themselves (PostgreSQL): a plain save, which commits.</summary>
public sealed class DirectWriteGate : IWriteGate
{
    public Task SaveAsync(AppDbContext db, CancellationToken ct = default) => db.SaveChangesAsync(ct);
}
