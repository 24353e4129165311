namespace EventReview.Data.Writes;

/// <summary>
/// The one way changes reach the database. A unit of work gets a fresh context, reads what it needs, changes it and
/// calls <c>SaveChangesAsync</c>; it either takes effect completely or not at all, and its task completes only once
/// the change is durable (committed).
/// </summary>
public interface IWriteGate
{
    /// <summary>Runs <paramref name="work"/> as one unit of work and returns its result after the commit.</summary>
    Task<T> RunAsync<T>(Func<AppDbContext, CancellationToken, Task<T>> work, CancellationToken ct = default);
}
