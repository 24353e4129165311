using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace EventReview.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class AppendOnlyRecords : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            foreach (var sql in EventReview.Data.AppendOnlySql.PostgresUp())
            {
                migrationBuilder.Sql(sql);
            }
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            foreach (var sql in EventReview.Data.AppendOnlySql.PostgresDown())
            {
                migrationBuilder.Sql(sql);
            }
        }
    }
}
