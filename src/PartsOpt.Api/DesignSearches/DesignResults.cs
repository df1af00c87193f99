using System.Globalization;
using PartsOpt.Search;
using PartsOpt.Topologies;
using PartsOpt.Values;

namespace PartsOpt.Api.DesignSearches;

/// <summary>A found design as the API states it: roles with designators, BOM, cost, figures and checks.</summary>
public static class DesignResults
{
    public static DesignResult From(FoundDesign found, Stockroom stockroom)
    {
        var design = found.Design;
        var evaluation = found.Evaluation;
        var roles = design.RequiredRoles().Select(role => Role(role, found, stockroom)).ToList();

        var designatorsByPart = new Dictionary<string, List<string>>(StringComparer.OrdinalIgnoreCase);
        void Designate(string partNumber, string designator)
        {
            if (!designatorsByPart.TryGetValue(partNumber, out var list))
                designatorsByPart[partNumber] = list = [];
            list.Add(designator);
        }
        foreach (var role in roles)
        {
            if (role.PartNumbers.Count == 1)
                Designate(role.PartNumbers[0], role.Designator);
            else
                for (var i = 0; i < role.PartNumbers.Count; i++)
                    Designate(role.PartNumbers[i], role.Designator + (char)('a' + i)); // R3a, R3b: one role, two parts
        }
        foreach (var section in evaluation.Sections.Where(s => s.PartNumber is not null))
        {
            var package = section.Designator.TrimEnd('A', 'B', 'C', 'D', 'E', 'F', 'G', 'H');
            if (!designatorsByPart.TryGetValue(section.PartNumber!, out var list) || !list.Contains(package))
                Designate(section.PartNumber!, package);
        }
        // Decoupling capacitors are not roles: they take the capacitor designators after the roles'.
        var nextCapacitor = roles.Count(r => Roles.KindOf(r.Role) == RoleKind.Capacitor) + 1;
        var nextPackage = evaluation.Sections.Select(s => s.Designator.TrimEnd('A', 'B', 'C', 'D', 'E', 'F', 'G', 'H')).Distinct().Count() + 1;

        var bom = new List<BomLineDto>();
        foreach (var line in found.Bom)
        {
            var stocked = stockroom.Parts[line.PartNumber];
            var part = stocked.Part;
            var designators = designatorsByPart.TryGetValue(line.PartNumber, out var known) ? known : [];
            while (designators.Count < line.PerBoard)
                designators.Add(part.Kind == Parts.PartKind.OpAmp
                    ? Say($"U{nextPackage++}")
                    : Say($"C{nextCapacitor++}"));
            bom.Add(new BomLineDto(designators, part.PartNumber, part.Description, ValueOf(part), line.Uses,
                line.PerBoard, line.ForBuild, line.UnitCost, line.UnitCost * line.ForBuild, part.Currency,
                stocked.OnHand, line.Available));
        }

        var cost = found.Cost;
        var currencies = bom.Select(b => b.Currency).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal);
        return new DesignResult(
            cost.BuildQuantity,
            new SupplyDto(design.Supply.PositiveV, design.Supply.NegativeV),
            design.Amplifier.PartNumber ?? "",
            design.Comparator?.PartNumber,
            design.BufferReference,
            design.DutyControl is ControlVoltageDuty ? DesignSearchRules.ControlVoltage : DesignSearchRules.Potentiometer,
            new CostDto(cost.PartsCost, cost.Placements, cost.LineItems, cost.Model.PlacementCost, cost.Model.LineItemSetupCost,
                cost.PerBoard, cost.TotalBuildCost, string.Join('/', currencies)),
            roles,
            bom,
            evaluation.Figures.Select(f => new FigureDto(f.Name, Finite(f.Value), f.Unit)).ToList(),
            evaluation.Checks.Select(c => new CheckDto(c.Name, c.Passed, Finite(c.Margin), c.MarginUnit,
                c.Severity == CheckSeverity.Failure ? "failure" : "warning", c.Reason)).ToList(),
            evaluation.Sections.Select(s => new SectionDto(s.Function, s.Designator, s.PartNumber)).ToList(),
            Finite(found.FrequencyError),
            Finite(found.Margin),
            [.. found.Notes, .. evaluation.Notes]);
    }

    private static RoleDto Role(string role, FoundDesign found, Stockroom stockroom)
    {
        var part = found.Design.Roles[role];
        var numbers = found.RoleParts.TryGetValue(role, out var n) ? n : [part.PartNumber ?? ""];
        var kind = Roles.KindOf(role);
        var quantity = kind == RoleKind.Capacitor ? Quantity.Capacitance : Quantity.Resistance;
        return new RoleDto(role, found.Evaluation.Designators[role], numbers, part.Value,
            EngineeringValue.Format(part.Value, quantity), numbers.Count > 1 ? Combination(kind, part.Value, numbers, stockroom) : null,
            part.ToleranceMinus, part.TolerancePlus);
    }

    /// <summary>
    /// Series or parallel, read back from the value: a pair that adds up is resistors in series or
    /// capacitors in parallel; one whose reciprocals add is the other way round.
    /// </summary>
    private static string Combination(RoleKind kind, double value, IReadOnlyList<string> numbers, Stockroom stockroom)
    {
        var values = numbers.Select(pn => stockroom.Parts.TryGetValue(pn, out var s)
            ? s.Part.ResistanceOhms ?? s.Part.CapacitanceF : null).ToList();
        if (values.Count != 2 || values.Any(v => v is null))
            return "combination";
        var (a, b) = (values[0]!.Value, values[1]!.Value);
        var adds = Math.Abs(value - (a + b)) < Math.Abs(value - a * b / (a + b));
        return adds == (kind != RoleKind.Capacitor) ? "series" : "parallel";
    }

    private static string ValueOf(Parts.Part part) => part.Kind switch
    {
        Parts.PartKind.Capacitor when part.CapacitanceF is { } f => EngineeringValue.Format(f, Quantity.Capacitance),
        Parts.PartKind.Resistor or Parts.PartKind.Potentiometer when part.ResistanceOhms is { } r => EngineeringValue.Format(r, Quantity.Resistance),
        _ => "",
    };

    private static double? Finite(double? value) => value is { } v && double.IsFinite(v) ? v : null;

    private static string Say(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
