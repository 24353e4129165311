using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace EventReview.Data.Migrations.Sqlite
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
