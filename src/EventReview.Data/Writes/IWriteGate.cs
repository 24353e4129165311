namespace EventReview.Data.Writes;

/// <summary>
/// The one way changes reach the database. A caller reads what it needs with its own context, changes it, and hands
/// the context here instead of calling <c>SaveChangesAsync</c>: its pending changes are stored completely or not at
/// all, and the task completes only once they are durable (committed). Conflicts with changes made since the read
/// surface as <see cref="Microsoft.EntityFrameworkCore.DbUpdateException"/>, as with a plain save.
/// </summary>
public interface IWriteGate
{
    /// <summary>Stores the pending changes of <paramref name="db"/> as one unit and returns after the commit.</summary>
    Task SaveAsync(AppDbContext db, CancellationToken ct = default);

    /// <summary>
    /// Runs <paramref name="work"/> on a fresh context that reads the latest committed state with no other writer in
    /// between (for the embedded database: inside the writer itself), and returns its result after the commit. The work
    /// reads, changes and calls <c>SaveChangesAsync</c> once at its end. Slower than <see cref="SaveAsync"/> under load;
    /// meant for a retry after a conflict.
    /// </summary>
    Task<T> RunAsync<T>(Func<AppDbContext, CancellationToken, Task<T>> work, CancellationToken ct = default);

    /// <summary>
    /// Runs hand-written SQL (<paramref name="work"/>) as one unit inside a transaction, stored completely or not at
    /// all, and returns its result after the commit. For the embedded database it runs inside the single writer, with
    /// no other writer in between, and its statements are prepared once; for a database server it runs in its own
    /// transaction, and the SQL takes the locks it needs.
    /// </summary>
    Task<T> RunSqlAsync<T>(Func<SqlUnit, CancellationToken, Task<T>> work, CancellationToken ct = default);
}
