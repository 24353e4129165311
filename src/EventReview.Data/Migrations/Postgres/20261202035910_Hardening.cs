using System;
using Microsoft.EntityFrameworkCore.Migrations;
using Npgsql.EntityFrameworkCore.PostgreSQL.Metadata;

#nullable disable

namespace EventReview.Data.Migrations.Postgres
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
            migrationBuilder.AddColumn<DateTimeOffset>(
                name: "ExpiresAt",
                table: "ApiTokens",
                type: "timestamp with time zone",
                nullable: false,
                defaultValue: new DateTimeOffset(new DateTime(1, 1, 1, 0, 0, 0, 0, DateTimeKind.Unspecified), new TimeSpan(0, 0, 0, 0, 0)));

            migrationBuilder.AddColumn<string>(
                name: "Scopes",
                table: "ApiTokens",
                type: "character varying(200)",
                maxLength: 200,
                nullable: false,
                defaultValue: "");

            migrationBuilder.CreateTable(
                name: "AccountEvents",
                columns: table => new
                {
                    Id = table.Column<long>(type: "bigint", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    Sequence = table.Column<long>(type: "bigint", nullable: false),
                    At = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false),
                    Kind = table.Column<string>(type: "character varying(32)", maxLength: 32, nullable: false),
                    UserId = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    Account = table.Column<string>(type: "character varying(120)", maxLength: 120, nullable: false),
                    Address = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    Detail = table.Column<string>(type: "character varying(300)", maxLength: 300, nullable: false),
                    PreviousHash = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    Hash = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false)
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

            migrationBuilder.Sql(EventReview.Data.AppendOnlySql.PostgresTokenBackfill);
            foreach (var sql in EventReview.Data.AppendOnlySql.AccountEventsPostgresUp())
            {
                migrationBuilder.Sql(sql);
            }
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            foreach (var sql in EventReview.Data.AppendOnlySql.AccountEventsPostgresDown())
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
