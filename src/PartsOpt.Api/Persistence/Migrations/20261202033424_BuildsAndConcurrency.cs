using System;
using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace PartsOpt.Api.Persistence.Migrations
{
    /// <inheritdoc />
    public partial class BuildsAndConcurrency : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.AddColumn<int>(
                name: "Version",
                table: "Parts",
                type: "INTEGER",
                nullable: false,
                defaultValue: 0);

            migrationBuilder.CreateTable(
                name: "Builds",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    DesignId = table.Column<int>(type: "INTEGER", nullable: false),
                    Quantity = table.Column<int>(type: "INTEGER", nullable: false),
                    Reference = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    Note = table.Column<string>(type: "TEXT", maxLength: 500, nullable: false),
                    Status = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    Actor = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    ReservedAtUtc = table.Column<DateTime>(type: "TEXT", nullable: false),
                    ClosedBy = table.Column<string>(type: "TEXT", maxLength: 100, nullable: true),
                    ClosedAtUtc = table.Column<DateTime>(type: "TEXT", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Builds", x => x.Id);
                    table.CheckConstraint("CK_Builds_Quantity", "Quantity >= 1");
                });

            migrationBuilder.CreateTable(
                name: "BuildLines",
                columns: table => new
                {
                    Id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    BuildId = table.Column<int>(type: "INTEGER", nullable: false),
                    PartNumber = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false, collation: "NOCASE"),
                    PerUnit = table.Column<int>(type: "INTEGER", nullable: false),
                    Reserved = table.Column<int>(type: "INTEGER", nullable: false),
                    Consumed = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_BuildLines", x => x.Id);
                    table.CheckConstraint("CK_BuildLines_Quantities", "PerUnit >= 1 AND Reserved >= 1 AND Consumed >= 0 AND Consumed <= Reserved");
                    table.ForeignKey(
                        name: "FK_BuildLines_Builds_BuildId",
                        column: x => x.BuildId,
                        principalTable: "Builds",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateIndex(
                name: "IX_BuildLines_BuildId_PartNumber",
                table: "BuildLines",
                columns: new[] { "BuildId", "PartNumber" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_Builds_Status_Id",
                table: "Builds",
                columns: new[] { "Status", "Id" });
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "BuildLines");

            migrationBuilder.DropTable(
                name: "Builds");

            migrationBuilder.DropColumn(
                name: "Version",
                table: "Parts");
        }
    }
}
