namespace SlotOpt.Plates.Thermal;

/// <summary>
/// How the plate is cooled: convection from both faces (natural convection in air or oil, or a fixed
/// coefficient), radiation from both faces to surroundings at ambient (emissivity 0 turns it off),
/// and the outer edge insulated or held at ambient. VerticalLengthM is the plate's height along
/// gravity, the length of the natural-convection correlation.
/// </summary>
public sealed record PlateCooling
{
    public PlateCooling(CoolingMedium medium, double ambientK, double emissivity, ThermalEdge edges, double? fixedCoefficientWPerM2K = null, double verticalLengthM = double.NaN)
    {
        if (!(ambientK > 0) || !double.IsFinite(ambientK)) throw new InputException($"the ambient temperature must be above absolute zero (got {ambientK} K)");
        if (!(emissivity >= 0 && emissivity <= 1)) throw new InputException($"the emissivity must lie between 0 and 1 (got {emissivity})");
        if (medium == CoolingMedium.Fixed && !(fixedCoefficientWPerM2K > 0 && double.IsFinite(fixedCoefficientWPerM2K.Value)))
            throw new InputException($"fixed cooling needs a positive heat transfer coefficient h (got {fixedCoefficientWPerM2K?.ToString() ?? "none"} W/m2K)");
        if (medium != CoolingMedium.Fixed && fixedCoefficientWPerM2K is not null)
            throw new InputException("a heat transfer coefficient h is given only with fixed cooling; air and oil compute it from the rise");
        if (medium != CoolingMedium.Fixed && !(verticalLengthM > 0 && double.IsFinite(verticalLengthM)))
            throw new InputException($"natural convection needs the plate's positive vertical length (got {verticalLengthM} m)");
        Medium = medium;
        AmbientK = ambientK;
        Emissivity = emissivity;
        Edges = edges;
        FixedCoefficientWPerM2K = fixedCoefficientWPerM2K;
        VerticalLengthM = verticalLengthM;
    }

    public CoolingMedium Medium { get; }
    public double AmbientK { get; }
    public double Emissivity { get; }
    public ThermalEdge Edges { get; }
    public double? FixedCoefficientWPerM2K { get; }
    public double VerticalLengthM { get; }
}
