using System;
using Microsoft.EntityFrameworkCore.Migrations;
using Npgsql.EntityFrameworkCore.PostgreSQL.Metadata;

#nullable disable

namespace EventReview.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class SealedInjectionRecords : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
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
                name: "IX_SealedInjectionRecords_Commitment",
                table: "SealedInjectionRecords",
                column: "Commitment",
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "SealedInjectionRecords");
        }
    }
}
