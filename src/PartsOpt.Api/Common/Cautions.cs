namespace PartsOpt.Api.Common;

/// <summary>
/// The cautions every analysed or proposed design carries. A PWM generator's output usually switches a
/// power stage; what PartsOpt checks stops at the low-voltage control circuit. Common practice, not a
/// substitute for the codes and standards that apply where the product is built and used.
/// </summary>
public static class Cautions
{
    /// <summary>Power-stage and high-voltage cautions, shown with every circuit answer.</summary>
    public static IReadOnlyList<string> PowerStage { get; } =
    [
        "This analysis covers the low-voltage PWM control circuit only. It does not make the power stage it drives safe.",
        "Power stages and high-voltage supplies driven by this PWM can injure or kill: isolate the control circuit where the stage is mains-connected or above safety extra-low voltage, and keep creepage and clearance distances.",
        "Drive MOSFET and IGBT gates through a proper gate driver; check dead time, shoot-through, fusing, protective earth and thermal limits of the stage under fault conditions.",
        "Decide what the load does when the PWM stops, starts or sticks at 0 % or 100 % duty (power-up, brown-out, a failed op-amp): fail safe.",
        "Follow the electrical codes and product-safety standards that apply to you, and have mains or high-voltage work done or approved by a qualified, licensed person.",
    ];
}
