using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace EventReview.Data.Migrations.Sqlite
{
    /// <summary>
    /// Token scopes and expiry (existing tokens keep all scopes and expire 90 days after creation), the append-only
    /// sign-in audit (AccountEvents) and indexes on Cases.GpsNanoseconds and Cases.State for paging long case lists.
    /// </summary>
    public partial class Hardening : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.AddColumn<long>(
                name: "ExpiresAt",
                table: "ApiTokens",
                type: "INTEGER",
                nullable: false,
                defaultValue: 0L);

            migrationBuilder.AddColumn<string>(
                name: "Scopes",
                table: "ApiTokens",
                type: "TEXT",
                maxLength: 200,
                nullable: false,
                defaultValue: "");

            migrationBuilder.CreateTable(
                name: "AccountEvents",
                columns: table => new
                {
                    Id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Sequence = table.Column<long>(type: "INTEGER", nullable: false),
                    At = table.Column<long>(type: "INTEGER", nullable: false),
                    Kind = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    UserId = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    Account = table.Column<string>(type: "TEXT", maxLength: 120, nullable: false),
                    Address = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Detail = table.Column<string>(type: "TEXT", maxLength: 300, nullable: false),
                    PreviousHash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Hash = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_AccountEvents", x => x.Id);
                });

            migrationBuilder.CreateIndex(
                name: "IX_Cases_GpsNanoseconds",
                table: "Cases",
                column: "GpsNanoseconds");

            migrationBuilder.CreateIndex(
                name: "IX_Cases_State",
                table: "Cases",
                column: "State");

            migrationBuilder.CreateIndex(
                name: "IX_AccountEvents_Sequence",
                table: "AccountEvents",
                column: "Sequence",
                unique: true);

            migrationBuilder.Sql(EventReview.Data.AppendOnlySql.SqliteTokenBackfill);
            foreach (var sql in EventReview.Data.AppendOnlySql.AccountEventsSqliteUp())
            {
                migrationBuilder.Sql(sql);
            }
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            foreach (var sql in EventReview.Data.AppendOnlySql.AccountEventsSqliteDown())
            {
                migrationBuilder.Sql(sql);
            }

            migrationBuilder.DropTable(
                name: "AccountEvents");

            migrationBuilder.DropIndex(
                name: "IX_Cases_GpsNanoseconds",
                table: "Cases");

            migrationBuilder.DropIndex(
                name: "IX_Cases_State",
                table: "Cases");

            migrationBuilder.DropColumn(
                name: "ExpiresAt",
                table: "ApiTokens");

            migrationBuilder.DropColumn(
                name: "Scopes",
                table: "ApiTokens");
        }
    }
}
