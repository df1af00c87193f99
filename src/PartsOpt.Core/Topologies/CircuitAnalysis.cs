namespace PartsOpt.Topologies;

/// <summary>The closed-form analysis of a PWM generator design with real op-amp limits.</summary>
public static class CircuitAnalysis
{
    /// <summary>
    /// Validates <paramref name="design"/> and computes its figures, duty curve, designators, notes and checks.
    /// </summary>
    /// <param name="design">The design to analyse.</param>
    /// <param name="dutyCurvePoints">Points of the duty-versus-setting curve, at least 2 (default 21).</param>
    /// <exception cref="DesignValidationException">The design cannot be analysed (missing role, bad value…).</exception>
    public static CircuitEvaluation Analyse(CircuitDesign design, int dutyCurvePoints = 21)
    {
        ArgumentNullException.ThrowIfNull(design);
        design.Validate();
        throw new NotSupportedException("Work in progress: the analysis lands in the next commit.");
    }
}
