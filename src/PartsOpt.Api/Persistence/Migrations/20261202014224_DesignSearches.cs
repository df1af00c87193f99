using System;
using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace PartsOpt.Api.Persistence.Migrations
{
    /// <inheritdoc />
    public partial class DesignSearches : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "DesignSearches",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    CreatedAtUtc = table.Column<DateTime>(type: "TEXT", nullable: false),
                    Actor = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    RequirementJson = table.Column<string>(type: "TEXT", nullable: false),
                    Status = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    OptimalityProved = table.Column<bool>(type: "INTEGER", nullable: false),
                    ElapsedSeconds = table.Column<double>(type: "REAL", nullable: false),
                    Solves = table.Column<int>(type: "INTEGER", nullable: false),
                    NotesJson = table.Column<string>(type: "TEXT", nullable: false),
                    TopologiesJson = table.Column<string>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_DesignSearches", x => x.Id);
                });

            migrationBuilder.CreateTable(
                name: "Designs",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    SearchId = table.Column<int>(type: "INTEGER", nullable: false),
                    Rank = table.Column<int>(type: "INTEGER", nullable: false),
                    Topology = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    BestOfTopology = table.Column<bool>(type: "INTEGER", nullable: false),
                    CostPerBoard = table.Column<decimal>(type: "TEXT", nullable: false),
                    ResultJson = table.Column<string>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Designs", x => x.Id);
                    table.CheckConstraint("CK_Designs_Rank", "Rank >= 1");
                    table.ForeignKey(
                        name: "FK_Designs_DesignSearches_SearchId",
                        column: x => x.SearchId,
                        principalTable: "DesignSearches",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "DesignNeeds",
                columns: table => new
                {
                    Id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    DesignId = table.Column<int>(type: "INTEGER", nullable: false),
                    PartNumber = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false, collation: "NOCASE"),
                    QuantityForBuild = table.Column<int>(type: "INTEGER", nullable: false),
                    AvailableAtSearch = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_DesignNeeds", x => x.Id);
                    table.CheckConstraint("CK_DesignNeeds_Quantity", "QuantityForBuild > 0");
                    table.ForeignKey(
                        name: "FK_DesignNeeds_Designs_DesignId",
                        column: x => x.DesignId,
                        principalTable: "Designs",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateIndex(
                name: "IX_DesignNeeds_DesignId_PartNumber",
                table: "DesignNeeds",
                columns: new[] { "DesignId", "PartNumber" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_Designs_SearchId_Rank",
                table: "Designs",
                columns: new[] { "SearchId", "Rank" },
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "DesignNeeds");

            migrationBuilder.DropTable(
                name: "Designs");

            migrationBuilder.DropTable(
                name: "DesignSearches");
        }
    }
}
