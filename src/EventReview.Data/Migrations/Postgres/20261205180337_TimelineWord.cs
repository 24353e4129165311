using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace EventReview.Data.Migrations.Postgres
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
                ALTER TABLE public."Activity" RENAME TO "Timeline";
                """);
            migrationBuilder.Sql(
                """
                ALTER TABLE public."Timeline" RENAME CONSTRAINT "PK_Activity" TO "PK_Timeline";
                """);
            migrationBuilder.Sql(
                """
                ALTER TABLE public."Timeline" RENAME CONSTRAINT "FK_Activity_Cases_ReviewCaseId" TO "FK_Timeline_Cases_ReviewCaseId";
                """);
            migrationBuilder.Sql(
                """
                ALTER INDEX public."IX_Activity_ReviewCaseId_Sequence" RENAME TO "IX_Timeline_ReviewCaseId_Sequence";
                """);
            migrationBuilder.Sql(
                """
                ALTER SEQUENCE IF EXISTS public."Activity_Id_seq" RENAME TO "Timeline_Id_seq";
                """);
            migrationBuilder.Sql(
                """
                ALTER TRIGGER er_activity_append_only ON public."Timeline" RENAME TO er_timeline_append_only;
                """);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.Sql(
                """
                ALTER TRIGGER er_timeline_append_only ON public."Timeline" RENAME TO er_activity_append_only;
                """);
            migrationBuilder.Sql(
                """
                ALTER SEQUENCE IF EXISTS public."Timeline_Id_seq" RENAME TO "Activity_Id_seq";
                """);
            migrationBuilder.Sql(
                """
                ALTER INDEX public."IX_Timeline_ReviewCaseId_Sequence" RENAME TO "IX_Activity_ReviewCaseId_Sequence";
                """);
            migrationBuilder.Sql(
                """
                ALTER TABLE public."Timeline" RENAME CONSTRAINT "FK_Timeline_Cases_ReviewCaseId" TO "FK_Activity_Cases_ReviewCaseId";
                """);
            migrationBuilder.Sql(
                """
                ALTER TABLE public."Timeline" RENAME CONSTRAINT "PK_Timeline" TO "PK_Activity";
                """);
            migrationBuilder.Sql(
                """
                ALTER TABLE public."Timeline" RENAME TO "Activity";
                """);
        }
    }
}
