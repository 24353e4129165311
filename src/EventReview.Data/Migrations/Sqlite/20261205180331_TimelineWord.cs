using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace EventReview.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class TimelineWord : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            // One word for the record (decision 013): the table "Activity" becomes "Timeline", with its append-only
            // triggers renamed alongside (decision 010: literal SQL only).
            migrationBuilder.Sql(
                """
                DROP TRIGGER er_Activity_no_delete;
                """);
            migrationBuilder.Sql(
                """
                DROP TRIGGER er_Activity_no_update;
                """);
            migrationBuilder.Sql(
                """
                ALTER TABLE "Activity" RENAME TO "Timeline";
                """);
            migrationBuilder.Sql(
                """
                DROP INDEX "IX_Activity_ReviewCaseId_Sequence";
                """);
            migrationBuilder.Sql(
                """
                CREATE UNIQUE INDEX "IX_Timeline_ReviewCaseId_Sequence" ON "Timeline" ("ReviewCaseId", "Sequence");
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_Timeline_no_delete BEFORE DELETE ON "Timeline" BEGIN SELECT RAISE(ABORT, 'Timeline rows are append-only: they cannot be deleted'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_Timeline_no_update BEFORE UPDATE ON "Timeline" BEGIN SELECT RAISE(ABORT, 'Timeline rows are append-only: they cannot be updated'); END
                """);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.Sql(
                """
                DROP TRIGGER er_Timeline_no_delete;
                """);
            migrationBuilder.Sql(
                """
                DROP TRIGGER er_Timeline_no_update;
                """);
            migrationBuilder.Sql(
                """
                ALTER TABLE "Timeline" RENAME TO "Activity";
                """);
            migrationBuilder.Sql(
                """
                DROP INDEX "IX_Timeline_ReviewCaseId_Sequence";
                """);
            migrationBuilder.Sql(
                """
                CREATE UNIQUE INDEX "IX_Activity_ReviewCaseId_Sequence" ON "Activity" ("ReviewCaseId", "Sequence");
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_Activity_no_delete BEFORE DELETE ON "Activity" BEGIN SELECT RAISE(ABORT, 'Activity rows are append-only: they cannot be deleted'); END
                """);
            migrationBuilder.Sql(
                """
                CREATE TRIGGER er_Activity_no_update BEFORE UPDATE ON "Activity" BEGIN SELECT RAISE(ABORT, 'Activity rows are append-only: they cannot be updated'); END
                """);
        }
    }
}
