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
    /// <summary>Used only for the skin depth in the validity check; the thin-plate model itself assumes mu_r = 1.</summary>
    public double RelativePermeability { get; }
    public double SheetConductanceS => ConductivitySPerM * ThicknessM;
}
