using System;
using Microsoft.EntityFrameworkCore.Migrations;
using Npgsql.EntityFrameworkCore.PostgreSQL.Metadata;

#nullable disable

namespace EventReview.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class ConfigurationSnapshots : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "ConfigurationSnapshots",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    ReviewCaseId = table.Column<int>(type: "integer", nullable: true),
                    SiteCode = table.Column<string>(type: "character varying(8)", maxLength: 8, nullable: false),
                    Label = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    CapturedBy = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    CapturedByName = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    CapturedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false),
                    ItemsJson = table.Column<string>(type: "text", nullable: false),
                    IsFrozen = table.Column<bool>(type: "boolean", nullable: false),
                    FrozenBy = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    FrozenByName = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: true),
                    FrozenAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: true),
                    FreezeFrom = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: true),
                    FreezeUntil = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: true),
                    FreezeReason = table.Column<string>(type: "character varying(2000)", maxLength: 2000, nullable: true),
                    Fingerprint = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_ConfigurationSnapshots", x => x.Id);
                    table.ForeignKey(
                        name: "FK_ConfigurationSnapshots_Cases_ReviewCaseId",
                        column: x => x.ReviewCaseId,
                        principalTable: "Cases",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_ConfigurationSnapshots_ReviewCaseId",
                table: "ConfigurationSnapshots",
                column: "ReviewCaseId");

            migrationBuilder.CreateIndex(
                name: "IX_ConfigurationSnapshots_SiteCode_CapturedAt",
                table: "ConfigurationSnapshots",
                columns: new[] { "SiteCode", "CapturedAt" });

            foreach (var sql in EventReview.Data.AppendOnlySql.FrozenPostgresUp())
            {
                migrationBuilder.Sql(sql);
            }
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            foreach (var sql in EventReview.Data.AppendOnlySql.FrozenPostgresDown())
            {
                migrationBuilder.Sql(sql);
            }

            migrationBuilder.DropTable(
                name: "ConfigurationSnapshots");
        }
    }
}
