using System;
using Microsoft.EntityFrameworkCore.Migrations;
using Npgsql.EntityFrameworkCore.PostgreSQL.Metadata;

#nullable disable

namespace EventReview.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class RecordsOfConfigurationAndExports : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
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

            migrationBuilder.CreateIndex(
                name: "IX_DossierExports_ReviewCaseId",
                table: "DossierExports",
                column: "ReviewCaseId");

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
                name: "DossierExports");
        }
    }
}
