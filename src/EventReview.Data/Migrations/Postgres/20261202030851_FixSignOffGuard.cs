using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace EventReview.Data.Migrations.Postgres
{
    /// <summary>
    /// Replaces the PostgreSQL sign-off guard function: the one created by AppendOnlyRecords refused every UPDATE of a
    /// sign-off (a quoting slip in its column list), so a sign-off could not be marked stale. SQLite is unaffected.
    /// </summary>
    public partial class FixSignOffGuard : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.Sql(EventReview.Data.AppendOnlySql.PostgresSignOffGuardFunction());
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            // Nothing to undo: the broken function is not restored; AppendOnlyRecords' Down drops the fixed one.
        }
    }
}
