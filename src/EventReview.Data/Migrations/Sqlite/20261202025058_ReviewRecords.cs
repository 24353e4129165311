using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace EventReview.Data.Migrations.Sqlite
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
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ReviewCaseId = table.Column<int>(type: "INTEGER", nullable: true),
                    SiteCode = table.Column<string>(type: "TEXT", maxLength: 8, nullable: false),
                    Label = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    CapturedBy = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    CapturedByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    CapturedAt = table.Column<long>(type: "INTEGER", nullable: false),
                    ItemsJson = table.Column<string>(type: "TEXT", nullable: false),
                    IsFrozen = table.Column<bool>(type: "INTEGER", nullable: false),
                    FrozenBy = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    FrozenByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    FrozenAt = table.Column<long>(type: "INTEGER", nullable: true),
                    FreezeFrom = table.Column<long>(type: "INTEGER", nullable: true),
                    FreezeUntil = table.Column<long>(type: "INTEGER", nullable: true),
                    FreezeReason = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: true),
                    Fingerprint = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true)
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
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    ReviewCaseId = table.Column<int>(type: "INTEGER", nullable: false),
                    ManifestSha256 = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    ChainHead = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    SizeBytes = table.Column<long>(type: "INTEGER", nullable: false),
                    ExportedBy = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    ExportedByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    ExportedAt = table.Column<long>(type: "INTEGER", nullable: false)
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
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    Commitment = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Label = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    SealedById = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    SealedByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    SealedAt = table.Column<long>(type: "INTEGER", nullable: false),
                    OpenedById = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    OpenedByName = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    OpenedAt = table.Column<long>(type: "INTEGER", nullable: true),
                    OpenedInCaseId = table.Column<int>(type: "INTEGER", nullable: true),
                    OpenedSummary = table.Column<string>(type: "TEXT", maxLength: 1000, nullable: true),
                    OpenedRecord = table.Column<byte[]>(type: "BLOB", nullable: true),
                    OpenedSalt = table.Column<string>(type: "TEXT", maxLength: 256, nullable: true)
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

            foreach (var sql in EventReview.Data.AppendOnlySql.FrozenSqliteUp())
            {
                migrationBuilder.Sql(sql);
            }
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            foreach (var sql in EventReview.Data.AppendOnlySql.FrozenSqliteDown())
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
