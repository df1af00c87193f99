using System.Globalization;
using System.Runtime.CompilerServices;

namespace PartsOpt.Topologies;

/// <summary>
/// The checks of one analysis as they are made. A check's reason is written when it is wanted: for every
/// check of an explained analysis, and for a check that fails or warns in any. The design search judges
/// hundreds of thousands of designs and reads the reasons of the checks they miss, never of those they pass;
/// formatting those was most of what judging allocated.
/// </summary>
/// <param name="explain">Write the reason of every check, passed or not.</param>
internal sealed class CheckList(bool explain)
{
    /// <summary>Every check gets its reason.</summary>
    public bool Explain { get; } = explain;

    /// <summary>The checks so far, in the order made.</summary>
    public List<CircuitCheck> Items { get; } = new(24);

    public void Add(CircuitCheck check) => Items.Add(check);

    /// <summary>Adds a check from its margin (<see cref="CircuitChecks.Check"/>); its reason is formatted only when wanted.</summary>
    public void Add(string name, double margin, string unit, [InterpolatedStringHandlerArgument("", "margin")] ref Reason reason,
        CheckSeverity severity = CheckSeverity.Failure) =>
        Items.Add(CircuitChecks.Check(name, margin, unit, reason.Text(), severity));

    /// <summary>True when a check with this margin gets its reason: always when explaining, else when it does not pass.</summary>
    public bool Wants(double margin) => Explain || !(margin >= 0);

    /// <summary>A check's reason, formatted with the invariant culture, or not at all when it is not wanted.</summary>
    [InterpolatedStringHandler]
    public ref struct Reason
    {
        private DefaultInterpolatedStringHandler text;
        private readonly bool wanted;

        public Reason(int literalLength, int formattedCount, CheckList checks, double margin, out bool shouldAppend)
        {
            wanted = shouldAppend = checks.Wants(margin);
            text = wanted ? new DefaultInterpolatedStringHandler(literalLength, formattedCount, CultureInfo.InvariantCulture) : default;
        }

        public void AppendLiteral(string value) => text.AppendLiteral(value);

        public void AppendFormatted<T>(T value) => text.AppendFormatted(value);

        public void AppendFormatted<T>(T value, string? format) => text.AppendFormatted(value, format);

        internal string Text() => wanted ? text.ToStringAndClear() : "";
    }
}
