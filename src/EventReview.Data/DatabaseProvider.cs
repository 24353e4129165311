namespace EventReview.Data;

public enum DatabaseProvider
{
    Sqlite,
    Postgres,
}
