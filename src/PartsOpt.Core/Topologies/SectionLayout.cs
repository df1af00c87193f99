namespace PartsOpt.Topologies;

/// <summary>
/// Which op-amp sections a design uses and how they are packed into packages: the analog sections (and
/// the comparator, unless it is a separate part) fill U1A, U1B… in signal order, a separate comparator
/// part takes the next package of its own.
/// </summary>
internal sealed class SectionLayout
{
    public const string Oscillator = "oscillator";
    public const string Integrator = "integrator";
    public const string Schmitt = "schmitt";
    public const string Comparator = "comparator";
    public const string ReferenceBuffer = "reference buffer";

    private SectionLayout(IReadOnlyList<SectionAssignment> sections, int amplifierPackages, int comparatorPackages)
    {
        Sections = sections;
        AmplifierPackages = amplifierPackages;
        ComparatorPackages = comparatorPackages;
    }

    public IReadOnlyList<SectionAssignment> Sections { get; }
    public int AmplifierPackages { get; }
    public int ComparatorPackages { get; }

    public static SectionLayout For(CircuitDesign design)
    {
        var functions = new List<string>(5);
        functions.Add(design.Topology == TopologyKind.Loop ? Schmitt : Oscillator);
        if (design.Topology != TopologyKind.RcRamp)
            functions.Add(Integrator);
        if (design.Comparator is null)
            functions.Add(Comparator);
        if (design.BufferReference)
            functions.Add(ReferenceBuffer);

        var perPackage = design.Amplifier.SectionsPerPackage;
        var sections = new List<SectionAssignment>(functions.Count + 1);
        for (var i = 0; i < functions.Count; i++)
            sections.Add(new(functions[i], Designator(i / perPackage + 1, i % perPackage), design.Amplifier.PartNumber));
        var amplifierPackages = (functions.Count + perPackage - 1) / perPackage;
        var comparatorPackages = 0;
        if (design.Comparator is not null)
        {
            sections.Add(new(Comparator, Designator(amplifierPackages + 1, 0), design.Comparator.PartNumber));
            comparatorPackages = 1;
        }

        return new SectionLayout(sections, amplifierPackages, comparatorPackages);
    }

    private static string Designator(int package, int section) =>
        string.Create(System.Globalization.CultureInfo.InvariantCulture, $"U{package}{(char)('A' + section)}");
}
