using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace EventReview.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class SignedRecord : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.AddColumn<string>(
                name: "Facts",
                table: "Activity",
                type: "text",
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "KeyId",
                table: "Activity",
                type: "character varying(64)",
                maxLength: 64,
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "Mac",
                table: "Activity",
                type: "character varying(64)",
                maxLength: 64,
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "Facts",
                table: "AccountEvents",
                type: "text",
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "KeyId",
                table: "AccountEvents",
                type: "character varying(64)",
                maxLength: 64,
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "Mac",
                table: "AccountEvents",
                type: "character varying(64)",
                maxLength: 64,
                nullable: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropColumn(
                name: "Facts",
                table: "Activity");

            migrationBuilder.DropColumn(
                name: "KeyId",
                table: "Activity");

            migrationBuilder.DropColumn(
                name: "Mac",
                table: "Activity");

            migrationBuilder.DropColumn(
                name: "Facts",
                table: "AccountEvents");

            migrationBuilder.DropColumn(
                name: "KeyId",
                table: "AccountEvents");

            migrationBuilder.DropColumn(
                name: "Mac",
                table: "AccountEvents");
        }
    }
}
