using System;
using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace PartsOpt.Api.Persistence.Migrations
{
    /// <inheritdoc />
    public partial class InitialStock : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "Parts",
                columns: table => new
                {
                    Id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    PartNumber = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false, collation: "NOCASE"),
                    Kind = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    Description = table.Column<string>(type: "TEXT", maxLength: 500, nullable: false),
                    Package = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    UnitCost = table.Column<decimal>(type: "TEXT", nullable: false),
                    Currency = table.Column<string>(type: "TEXT", fixedLength: true, maxLength: 3, nullable: false),
                    ReorderLevel = table.Column<int>(type: "INTEGER", nullable: false),
                    Location = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    Notes = table.Column<string>(type: "TEXT", maxLength: 500, nullable: false),
                    ResistanceOhms = table.Column<double>(type: "REAL", nullable: true),
                    PowerRatingW = table.Column<double>(type: "REAL", nullable: true),
                    ToleranceMinus = table.Column<double>(type: "REAL", nullable: true),
                    TolerancePlus = table.Column<double>(type: "REAL", nullable: true),
                    ToleranceIsAbsolute = table.Column<bool>(type: "INTEGER", nullable: false),
                    TempcoPpmPerK = table.Column<double>(type: "REAL", nullable: true),
                    CapacitanceF = table.Column<double>(type: "REAL", nullable: true),
                    Dielectric = table.Column<string>(type: "TEXT", maxLength: 16, nullable: true),
                    VoltageRatingV = table.Column<double>(type: "REAL", nullable: true),
                    Polarised = table.Column<bool>(type: "INTEGER", nullable: true),
                    Taper = table.Column<string>(type: "TEXT", maxLength: 8, nullable: true),
                    Trimmer = table.Column<bool>(type: "INTEGER", nullable: true),
                    Sections = table.Column<int>(type: "INTEGER", nullable: true),
                    SupplyMinV = table.Column<double>(type: "REAL", nullable: true),
                    SupplyMaxV = table.Column<double>(type: "REAL", nullable: true),
                    GainBandwidthHz = table.Column<double>(type: "REAL", nullable: true),
                    SlewRateVPerS = table.Column<double>(type: "REAL", nullable: true),
                    OutputHeadroomLowV = table.Column<double>(type: "REAL", nullable: true),
                    OutputHeadroomHighV = table.Column<double>(type: "REAL", nullable: true),
                    InputHeadroomLowV = table.Column<double>(type: "REAL", nullable: true),
                    InputHeadroomHighV = table.Column<double>(type: "REAL", nullable: true),
                    InputOffsetV = table.Column<double>(type: "REAL", nullable: true),
                    OutputCurrentMaxA = table.Column<double>(type: "REAL", nullable: true),
                    QuiescentCurrentPerSectionA = table.Column<double>(type: "REAL", nullable: true),
                    Comparator = table.Column<bool>(type: "INTEGER", nullable: true),
                    OpenDrain = table.Column<bool>(type: "INTEGER", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Parts", x => x.Id);
                    table.CheckConstraint("CK_Parts_Capacitor", "Kind <> 'Capacitor' OR (CapacitanceF IS NOT NULL AND Dielectric IS NOT NULL AND VoltageRatingV IS NOT NULL AND Polarised IS NOT NULL)");
                    table.CheckConstraint("CK_Parts_OpAmp", "Kind <> 'OpAmp' OR (Sections IN (1, 2, 4) AND SupplyMinV IS NOT NULL AND SupplyMaxV IS NOT NULL AND Comparator IS NOT NULL AND OpenDrain IS NOT NULL)");
                    table.CheckConstraint("CK_Parts_Potentiometer", "Kind <> 'Potentiometer' OR (ResistanceOhms IS NOT NULL AND Taper IS NOT NULL AND Trimmer IS NOT NULL)");
                    table.CheckConstraint("CK_Parts_ReorderLevel", "ReorderLevel >= 0");
                    table.CheckConstraint("CK_Parts_Resistor", "Kind <> 'Resistor' OR (ResistanceOhms IS NOT NULL AND ToleranceMinus IS NOT NULL AND TolerancePlus IS NOT NULL)");
                });

            migrationBuilder.CreateTable(
                name: "Movements",
                columns: table => new
                {
                    Id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    PartId = table.Column<int>(type: "INTEGER", nullable: false),
                    Kind = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    OnHandChange = table.Column<int>(type: "INTEGER", nullable: false),
                    ReservedChange = table.Column<int>(type: "INTEGER", nullable: false),
                    Reason = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    Actor = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    AtUtc = table.Column<DateTime>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_Movements", x => x.Id);
                    table.CheckConstraint("CK_Movements_Signs", "(Kind = 'Receipt' AND OnHandChange > 0 AND ReservedChange = 0) OR (Kind = 'Adjustment' AND OnHandChange <> 0 AND ReservedChange = 0) OR (Kind = 'Reservation' AND OnHandChange = 0 AND ReservedChange > 0) OR (Kind = 'Release' AND OnHandChange = 0 AND ReservedChange < 0) OR (Kind = 'Consumption' AND OnHandChange < 0 AND ReservedChange = OnHandChange)");
                    table.ForeignKey(
                        name: "FK_Movements_Parts_PartId",
                        column: x => x.PartId,
                        principalTable: "Parts",
                        principalColumn: "Id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateIndex(
                name: "IX_Movements_PartId_Id",
                table: "Movements",
                columns: new[] { "PartId", "Id" });

            migrationBuilder.CreateIndex(
                name: "IX_Parts_Kind_CapacitanceF",
                table: "Parts",
                columns: new[] { "Kind", "CapacitanceF" });

            migrationBuilder.CreateIndex(
                name: "IX_Parts_Kind_ResistanceOhms",
                table: "Parts",
                columns: new[] { "Kind", "ResistanceOhms" });

            migrationBuilder.CreateIndex(
                name: "IX_Parts_PartNumber",
                table: "Parts",
                column: "PartNumber",
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "Movements");

            migrationBuilder.DropTable(
                name: "Parts");
        }
    }
}
