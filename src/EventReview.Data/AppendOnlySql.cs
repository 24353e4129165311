namespace EventReview.Data;

/// <summary>
/// Database triggers that make the record append-only even for direct SQL: timeline entries, evidence and computation
/// records can never be updated or deleted; a sign-off can only change from current to stale (nothing else), never be
/// deleted. Used by the AppendOnlyRecords migrations of both providers.
/// </summary>
public static class AppendOnlySql
{
    private static readonly string[] AppendOnlyTables = ["Activity", "Evidence", "Computations"];

    private const string SignOffColumns = "UserId, SignerName, SignedAtUtc, SignedAtGpsNanoseconds, Meaning, Statement, EvidenceFingerprint, ChecklistItemId";

    public static IEnumerable<string> SqliteUp()
    {
        foreach (var t in AppendOnlyTables)
        {
            yield return $"CREATE TRIGGER er_{t}_no_update BEFORE UPDATE ON \"{t}\" BEGIN SELECT RAISE(ABORT, '{t} rows are append-only: they cannot be updated'); END;";
            yield return $"CREATE TRIGGER er_{t}_no_delete BEFORE DELETE ON \"{t}\" BEGIN SELECT RAISE(ABORT, '{t} rows are append-only: they cannot be deleted'); END;";
        }

        var changed = string.Join(" OR ", SignOffColumns.Split(", ").Select(c => $"NEW.\"{c}\" IS NOT OLD.\"{c}\""));
        yield return $"CREATE TRIGGER er_SignOffs_guard BEFORE UPDATE ON \"SignOffs\" WHEN OLD.\"IsStale\" = 1 OR NEW.\"IsStale\" = 0 OR {changed} BEGIN SELECT RAISE(ABORT, 'A sign-off can only be marked stale; nothing else about it can change'); END;";
        yield return "CREATE TRIGGER er_SignOffs_no_delete BEFORE DELETE ON \"SignOffs\" BEGIN SELECT RAISE(ABORT, 'Sign-offs cannot be deleted'); END;";
    }

    /// <summary>Frozen configuration records can never be edited or deleted (SQLite).</summary>
    public static IEnumerable<string> FrozenSqliteUp()
    {
        yield return "CREATE TRIGGER er_ConfigurationSnapshots_frozen_update BEFORE UPDATE ON \"ConfigurationSnapshots\" WHEN OLD.\"IsFrozen\" = 1 BEGIN SELECT RAISE(ABORT, 'A frozen configuration record cannot be changed'); END;";
        yield return "CREATE TRIGGER er_ConfigurationSnapshots_frozen_delete BEFORE DELETE ON \"ConfigurationSnapshots\" WHEN OLD.\"IsFrozen\" = 1 BEGIN SELECT RAISE(ABORT, 'A frozen configuration record cannot be deleted'); END;";
    }

    public static IEnumerable<string> FrozenSqliteDown()
    {
        yield return "DROP TRIGGER IF EXISTS er_ConfigurationSnapshots_frozen_update;";
        yield return "DROP TRIGGER IF EXISTS er_ConfigurationSnapshots_frozen_delete;";
    }

    /// <summary>Frozen configuration records can never be edited or deleted (PostgreSQL).</summary>
    public static IEnumerable<string> FrozenPostgresUp()
    {
        yield return """
            CREATE FUNCTION er_frozen_configuration() RETURNS trigger AS $$
            BEGIN
              IF OLD."IsFrozen" THEN
                RAISE EXCEPTION 'A frozen configuration record cannot be %d', lower(TG_OP);
              END IF;
              IF TG_OP = 'DELETE' THEN
                RETURN OLD;
              END IF;
              RETURN NEW;
            END $$ LANGUAGE plpgsql;
            """;
        yield return "CREATE TRIGGER er_ConfigurationSnapshots_frozen BEFORE UPDATE OR DELETE ON \"ConfigurationSnapshots\" FOR EACH ROW EXECUTE FUNCTION er_frozen_configuration();";
    }

    public static IEnumerable<string> FrozenPostgresDown()
    {
        yield return "DROP TRIGGER IF EXISTS er_ConfigurationSnapshots_frozen ON \"ConfigurationSnapshots\";";
        yield return "DROP FUNCTION IF EXISTS er_frozen_configuration();";
    }

    public static IEnumerable<string> SqliteDown()
    {
        foreach (var t in AppendOnlyTables)
        {
            yield return $"DROP TRIGGER IF EXISTS er_{t}_no_update;";
            yield return $"DROP TRIGGER IF EXISTS er_{t}_no_delete;";
        }

        yield return "DROP TRIGGER IF EXISTS er_SignOffs_guard;";
        yield return "DROP TRIGGER IF EXISTS er_SignOffs_no_delete;";
    }

    public static IEnumerable<string> PostgresUp()
    {
        yield return """
            CREATE FUNCTION er_append_only() RETURNS trigger AS $$
            BEGIN
              RAISE EXCEPTION '% rows are append-only: they cannot be %d', TG_TABLE_NAME, lower(TG_OP);
            END $$ LANGUAGE plpgsql;
            """;
        foreach (var t in AppendOnlyTables)
        {
            yield return $"CREATE TRIGGER er_{t}_append_only BEFORE UPDATE OR DELETE ON \"{t}\" FOR EACH ROW EXECUTE FUNCTION er_append_only();";
        }

        yield return PostgresSignOffGuardFunction();
        yield return "CREATE TRIGGER er_SignOffs_guard BEFORE UPDATE OR DELETE ON \"SignOffs\" FOR EACH ROW EXECUTE FUNCTION er_signoff_guard();";
    }

    /// <summary>
    /// The PostgreSQL sign-off guard function (CREATE OR REPLACE). Until the FixSignOffGuard migration, the function
    /// compared <c>NEW."UserIdNEW."...</c> (a quoting slip) and so refused every update, marking stale included.
    /// </summary>
    public static string PostgresSignOffGuardFunction()
    {
        var columns = SignOffColumns.Split(", ");
        var newRow = string.Join(", ", columns.Select(c => $"NEW.\"{c}\""));
        var oldRow = string.Join(", ", columns.Select(c => $"OLD.\"{c}\""));
        return $$"""
            CREATE OR REPLACE FUNCTION er_signoff_guard() RETURNS trigger AS $$
            BEGIN
              IF TG_OP = 'DELETE' THEN
                RAISE EXCEPTION 'Sign-offs cannot be deleted';
              END IF;
              IF OLD."IsStale" OR NOT NEW."IsStale" OR ROW({{newRow}}) IS DISTINCT FROM ROW({{oldRow}}) THEN
                RAISE EXCEPTION 'A sign-off can only be marked stale; nothing else about it can change';
              END IF;
              RETURN NEW;
            END $$ LANGUAGE plpgsql;
            """;
    }

    public static IEnumerable<string> PostgresDown()
    {
        foreach (var t in AppendOnlyTables)
        {
            yield return $"DROP TRIGGER IF EXISTS er_{t}_append_only ON \"{t}\";";
        }

        yield return "DROP TRIGGER IF EXISTS er_SignOffs_guard ON \"SignOffs\";";
        yield return "DROP FUNCTION IF EXISTS er_signoff_guard();";
        yield return "DROP FUNCTION IF EXISTS er_append_only();";
    }

    /// <summary>Tokens made before scopes existed keep what they could do (all scopes) and expire 90 days after creation (SQLite ticks).</summary>
    public const string SqliteTokenBackfill =
        "UPDATE \"ApiTokens\" SET \"Scopes\" = 'cases:read cases:open evidence:add', \"ExpiresAt\" = \"CreatedAt\" + 90 * 864000000000 WHERE \"Scopes\" = '';";

    /// <summary>As <see cref="SqliteTokenBackfill"/> for PostgreSQL.</summary>
    public const string PostgresTokenBackfill =
        "UPDATE \"ApiTokens\" SET \"Scopes\" = 'cases:read cases:open evidence:add', \"ExpiresAt\" = \"CreatedAt\" + interval '90 days' WHERE \"Scopes\" = '';";

    /// <summary>The sign-in audit (AccountEvents) can never be updated or deleted (SQLite).</summary>
    public static IEnumerable<string> AccountEventsSqliteUp()
    {
        yield return "CREATE TRIGGER er_AccountEvents_no_update BEFORE UPDATE ON \"AccountEvents\" BEGIN SELECT RAISE(ABORT, 'AccountEvents rows are append-only: they cannot be updated'); END;";
        yield return "CREATE TRIGGER er_AccountEvents_no_delete BEFORE DELETE ON \"AccountEvents\" BEGIN SELECT RAISE(ABORT, 'AccountEvents rows are append-only: they cannot be deleted'); END;";
    }

    public static IEnumerable<string> AccountEventsSqliteDown()
    {
        yield return "DROP TRIGGER IF EXISTS er_AccountEvents_no_update;";
        yield return "DROP TRIGGER IF EXISTS er_AccountEvents_no_delete;";
    }

    /// <summary>The sign-in audit can never be updated or deleted (PostgreSQL; reuses er_append_only()).</summary>
    public static IEnumerable<string> AccountEventsPostgresUp()
    {
        yield return "CREATE TRIGGER er_AccountEvents_append_only BEFORE UPDATE OR DELETE ON \"AccountEvents\" FOR EACH ROW EXECUTE FUNCTION er_append_only();";
    }

    public static IEnumerable<string> AccountEventsPostgresDown()
    {
        yield return "DROP TRIGGER IF EXISTS er_AccountEvents_append_only ON \"AccountEvents\";";
    }
}
