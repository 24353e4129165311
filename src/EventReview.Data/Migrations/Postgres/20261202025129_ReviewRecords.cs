using System;
using Microsoft.EntityFrameworkCore.Migrations;
using Npgsql.EntityFrameworkCore.PostgreSQL.Metadata;

#nullable disable

namespace EventReview.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class ReviewRecords : Migration
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

            migrationBuilder.CreateTable(
                name: "DossierExports",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    ReviewCaseId = table.Column<int>(type: "integer", nullable: false),
                    ManifestSha256 = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    ChainHead = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    SizeBytes = table.Column<long>(type: "bigint", nullable: false),
                    ExportedBy = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    ExportedByName = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    ExportedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_DossierExports", x => x.Id);
                    table.ForeignKey(
                        name: "FK_DossierExports_Cases_ReviewCaseId",
                        column: x => x.ReviewCaseId,
                        principalTable: "Cases",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "SealedInjectionRecords",
                columns: table => new
                {
                    Id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    Commitment = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    Label = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    SealedById = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    SealedByName = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    SealedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: false),
                    OpenedById = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    OpenedByName = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: true),
                    OpenedAt = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: true),
                    OpenedInCaseId = table.Column<int>(type: "integer", nullable: true),
                    OpenedSummary = table.Column<string>(type: "character varying(1000)", maxLength: 1000, nullable: true),
                    OpenedRecord = table.Column<byte[]>(type: "bytea", nullable: true),
                    OpenedSalt = table.Column<string>(type: "character varying(256)", maxLength: 256, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_SealedInjectionRecords", x => x.Id);
                });

            migrationBuilder.CreateIndex(
                name: "IX_ConfigurationSnapshots_ReviewCaseId",
                table: "ConfigurationSnapshots",
                column: "ReviewCaseId");

            migrationBuilder.CreateIndex(
                name: "IX_ConfigurationSnapshots_SiteCode_CapturedAt",
                table: "ConfigurationSnapshots",
                columns: new[] { "SiteCode", "CapturedAt" });

            migrationBuilder.CreateIndex(
                name: "IX_DossierExports_ReviewCaseId",
                table: "DossierExports",
                column: "ReviewCaseId");

            migrationBuilder.CreateIndex(
                name: "IX_SealedInjectionRecords_Commitment",
                table: "SealedInjectionRecords",
                column: "Commitment",
                unique: true);

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

            migrationBuilder.DropTable(
                name: "DossierExports");

            migrationBuilder.DropTable(
                name: "SealedInjectionRecords");
        }
    }
}
