namespace PartsOpt.Search;

/// <summary>
/// The exact engine's word on one assignment. A rejection names the slots its reason depends on, so the
/// no-good cut forbids every assignment sharing those choices (a stronger cut than the whole assignment).
/// </summary>
/// <param name="Accepted">True when every figure is inside its band and every failure check passes.</param>
/// <param name="CutSlots">On rejection: the slots whose choices alone decide the failure; null for all.</param>
/// <param name="FrequencyError">|f − target| / target of the nominal design (first tie-break, smaller wins).</param>
/// <param name="Margin">Smallest relative distance of a figure from its band edge (second tie-break, larger wins).</param>
/// <param name="Reason">Why it was rejected, in a designer's words.</param>
/// <param name="Payload">Whatever the caller wants back with an accepted design (figures, checks).</param>
internal sealed record SelectionVerdict(
    bool Accepted,
    IReadOnlyList<int>? CutSlots = null,
    double FrequencyError = 0,
    double Margin = 0,
    string? Reason = null,
    object? Payload = null)
{
    /// <summary>
    /// With <see cref="CutEscape"/>: a tuple group whose tuples may lift the cut. The cut then reads "not
    /// these choices in <see cref="CutSlots"/>, unless one of the escape tuples is chosen": a monotone
    /// figure (duty against threshold) rules out every tuple no better than the one that failed.
    /// </summary>
    public int? CutGroup { get; init; }

    /// <summary>Tuples of <see cref="CutGroup"/> (or options of <see cref="CutEscapeSlot"/>) that escape the cut.</summary>
    public IReadOnlyList<int>? CutEscape { get; init; }

    /// <summary>
    /// With <see cref="CutEscape"/>: a slot inside <see cref="CutSlots"/> whose other options may lift the
    /// cut: a figure monotone in that part's value (power in a resistor, an output's current) rules out
    /// every option no better than the one that failed.
    /// </summary>
    public int? CutEscapeSlot { get; init; }

    /// <summary>
    /// Options of slots outside <see cref="CutSlots"/> that lift the cut: "not these choices in
    /// <see cref="CutSlots"/>, unless one of these options is chosen". A duty range missed with a threshold
    /// divider too large for a tuple group: every divider no better in each of its three values fails too.
    /// </summary>
    public IReadOnlyList<(int Slot, int Option)>? CutEscapeOptions { get; init; }

    /// <summary>
    /// Further no-good cuts the verifier found while it was at it (other assignments of the same slots it
    /// judged and rejected for a reason confined to those slots): each forbids its choices in its slots.
    /// </summary>
    public IReadOnlyList<(int[] Choice, IReadOnlyList<int> Slots)> MoreCuts { get; init; } = [];
}

/// <summary>An assignment the engine accepted, with its exact integer objective.</summary>
internal sealed record AcceptedChoice(int[] Choice, long Objective, SelectionVerdict Verdict)
{
    /// <summary>Accepted designs of one variant in rank order: cost, frequency error, margin (larger first), choice.</summary>
    public static List<AcceptedChoice> InRankOrder(IEnumerable<AcceptedChoice> accepted) =>
        accepted
            .OrderBy(a => a.Objective)
            .ThenBy(a => a.Verdict.FrequencyError)
            .ThenByDescending(a => a.Verdict.Margin)
            .ThenBy(a => string.Join(',', a.Choice))
            .ToList();
}

/// <summary>What a run of the lazy loop produced.</summary>
/// <param name="Accepted">Every assignment accepted in the run, in rank order (objective, then tie-breaks,
/// then choice): ties past the number wanted included, since each is already forbidden in the model and a
/// later run of the same model would never see it again.</param>
/// <param name="Complete">True when the solver proved no better or tied assignment was left unexamined:
/// the list is exactly the top of the feasible set (optimality proved).</param>
/// <param name="Solves">Number of CP-SAT solves.</param>
/// <param name="Rejections">Assignments the engine rejected, in the order found.</param>
internal sealed record SelectionRun(
    IReadOnlyList<AcceptedChoice> Accepted,
    bool Complete,
    int Solves,
    IReadOnlyList<(int[] Choice, SelectionVerdict Verdict)> Rejections);
