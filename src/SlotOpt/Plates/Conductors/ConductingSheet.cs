namespace SlotOpt.Plates.Conductors;

/// <summary>The plate's material and thickness: sheet conductance G = sigma t (siemens).</summary>
public sealed record ConductingSheet
{
    public ConductingSheet(double conductivitySPerM, double thicknessM, double relativePermeability = 1)
    {
        if (!(conductivitySPerM > 0) || !double.IsFinite(conductivitySPerM)) throw new InputException($"the conductivity must be positive (got {conductivitySPerM} S/m)");
        if (!(thicknessM > 0) || !double.IsFinite(thicknessM)) throw new InputException($"the plate thickness must be positive (got {thicknessM} m)");
        if (!(relativePermeability >= 1) || !double.IsFinite(relativePermeability)) throw new InputException($"the relative permeability must be >= 1 (got {relativePermeability})");
        ConductivitySPerM = conductivitySPerM;
        ThicknessM = thicknessM;
        RelativePermeability = relativePermeability;
    }

    public double ConductivitySPerM { get; }
    public double ThicknessM { get; }
    /// <summary>Used only for the skin depth in the validity check; the thin-plate model itself assumes mu_r = 1 (<see cref="RecedingImageSpeedMPerS"/> holds none).</summary>
    public double RelativePermeability { get; }
    public double SheetConductanceS => ConductivitySPerM * ThicknessM;

    /// <summary>
    /// The receding-image speed w = 2 / (mu0 sigma t) (m/s; J. C. Maxwell, A Treatise on Electricity and Magnetism, 1873, vol. 2, arts. 656-660;
    /// W. M. Saslow, Am. J. Phys. 60 (1992) 693, its v0): a slide's magnetic Reynolds number is v / w, and a thin sheet's drag peaks near it.
    /// No mu_r: in a sheet thin against its skin depth the current condition (the jump of tangential H is sigma t E) holds no permeability;
    /// mu_r enters through the skin depth (the validity) and the separate flux condition (the jump of normal B, -mu t div H_t), which the thin-plate model leaves out.
    /// </summary>
    public double RecedingImageSpeedMPerS => 2 / (Validity.Mu0 * SheetConductanceS);   // w = 2 / (mu0 sigma t), Saslow (1992)
}
